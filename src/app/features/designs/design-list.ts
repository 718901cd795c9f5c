import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { Router, RouterLink } from '@angular/router';
import { debounceTime, distinctUntilChanged, map } from 'rxjs';
import { Api } from '../../core/api';
import type { Design, DesignSummary } from '../../core/api-types';
import { errorMessage } from '../../core/error-message';
import { queryPage } from '../../core/query-page';
import { canEdit } from '../../core/roles';
import { WorkspaceContext } from '../../core/workspace-context';
import { ConfirmDialog, type ConfirmData } from '../../ui/confirm-dialog';
import { ReviewChip } from '../../ui/review-chip';
import { NewDesignDialog, type NewDesignData } from './new-design-dialog';
import { ImportOutlineDialog, type ImportOutlineData } from '../files/import-outline-dialog';

type SortKey = 'name' | 'updatedAt' | 'reviewState';

interface Query {
  wid: string | number | null;
  q: string;
  sort: SortKey;
  order: 'asc' | 'desc';
  pageIndex: number;
  pageSize: number;
  reload: number;
}

/**
 * The workspace's designs: a server-side sorted, filtered and paged table, "New design", and for editors and
 * owners a delete action per row (after a confirmation that names what goes with the design).
 */
@Component({
  selector: 'osm-design-list',
  imports: [
    DatePipe,
    ReactiveFormsModule,
    RouterLink,
    MatTableModule,
    MatSortModule,
    MatPaginatorModule,
    MatFormFieldModule,
    MatInputModule,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    MatTooltipModule,
    ReviewChip,
  ],
  templateUrl: './design-list.html',
  styleUrl: './design-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DesignList {
  private readonly api = inject(Api);
  private readonly dialog = inject(MatDialog);
  private readonly router = inject(Router);
  private readonly snack = inject(MatSnackBar);
  protected readonly context = inject(WorkspaceContext);
  protected readonly pageSizes = [10, 25, 50];
  protected readonly filter = new FormControl('', { nonNullable: true });
  protected readonly mayCreate = computed(() => canEdit(this.context.role()));
  /** Editors and owners delete designs (the server checks the same role); reviewers and viewers see no action. */
  protected readonly mayDelete = computed(() => canEdit(this.context.role()));
  protected readonly columns = computed(() => ['name', 'reviewState', 'updatedAt', 'updatedBy', ...(this.mayDelete() ? ['actions'] : [])]);
  /** The design whose deletion is under way (its button waits). */
  protected readonly deleting = signal<DesignSummary['id'] | null>(null);

  private readonly query = signal<Query>({ wid: null, q: '', sort: 'updatedAt', order: 'desc', pageIndex: 0, pageSize: 25, reload: 0 });
  protected readonly sort = computed(() => ({ active: this.query().sort, direction: this.query().order }));
  protected readonly pageIndex = computed(() => this.query().pageIndex);
  protected readonly pageSize = computed(() => this.query().pageSize);

  private readonly list = queryPage(this.query, (q) =>
    q.wid === null
      ? null
      : this.api.designs(q.wid, { q: q.q, sort: q.sort, order: q.order, limit: q.pageSize, offset: q.pageIndex * q.pageSize }),
  );
  protected readonly loading = this.list.loading;
  protected readonly error = this.list.error;
  protected readonly page = this.list.page;

  constructor() {
    const wid = computed(() => this.context.current()?.id ?? null);
    toObservable(wid)
      .pipe(takeUntilDestroyed())
      .subscribe((id) => this.query.update((q) => ({ ...q, wid: id, pageIndex: 0 })));

    this.filter.valueChanges
      .pipe(
        debounceTime(250),
        map((v) => v.trim()),
        distinctUntilChanged(),
        takeUntilDestroyed(),
      )
      .subscribe((q) => this.query.update((s) => ({ ...s, q, pageIndex: 0 })));
  }

  protected onSort(sort: Sort): void {
    const key = (sort.active as SortKey) || 'updatedAt';
    const order = sort.direction || (key === 'updatedAt' ? 'desc' : 'asc');
    this.query.update((q) => ({ ...q, sort: key, order, pageIndex: 0 }));
  }

  protected onPage(event: PageEvent): void {
    this.query.update((q) => ({ ...q, pageIndex: event.pageIndex, pageSize: event.pageSize }));
  }

  protected clearFilter(): void {
    this.filter.setValue('');
  }

  protected importOutline(): void {
    const ws = this.context.current();
    if (!ws) return;
    this.dialog
      .open<ImportOutlineDialog, ImportOutlineData, { id: number }>(ImportOutlineDialog, { data: { workspaceId: ws.id }, width: '760px', maxWidth: '95vw' })
      .afterClosed()
      .subscribe((design) => {
        if (design) void this.router.navigate(['/designs', String(design.id)]);
      });
  }

  /** Asks, then deletes the design with its revisions, runs, comments and files, and reads the page again. */
  protected deleteDesign(design: DesignSummary): void {
    if (this.deleting() !== null) return;
    this.dialog
      .open<ConfirmDialog, ConfirmData, boolean>(ConfirmDialog, {
        data: {
          title: `Delete “${design.name}”?`,
          message:
            `The design “${design.name}” is deleted with all its revisions, runs, comments and files, for everyone in ` +
            'this workspace. This cannot be undone.',
          confirm: 'Delete design',
        },
      })
      .afterClosed()
      .subscribe((ok) => {
        if (!ok) return;
        this.deleting.set(design.id);
        this.api.deleteDesign(design.id).subscribe({
          next: () => {
            this.deleting.set(null);
            this.snack.open(`“${design.name}” was deleted.`, undefined, { duration: 4000 });
            // The last row of a later page: show the page before it.
            const lastOnPage = this.page().items.length === 1 && this.query().pageIndex > 0;
            this.query.update((q) => ({ ...q, pageIndex: lastOnPage ? q.pageIndex - 1 : q.pageIndex, reload: q.reload + 1 }));
          },
          error: (err: unknown) => {
            this.deleting.set(null);
            this.snack.open(`“${design.name}” was not deleted: ${errorMessage(err)}`, 'Close', { duration: 8000 });
          },
        });
      });
  }

  protected newDesign(): void {
    const ws = this.context.current();
    if (!ws) return;
    this.dialog
      .open<NewDesignDialog, NewDesignData, Design>(NewDesignDialog, { data: { workspaceId: ws.id }, width: '720px', maxWidth: '95vw', autoFocus: 'first-tabbable' })
      .afterClosed()
      .subscribe((design) => {
        if (design) void this.router.navigate(['/designs', String(design.id)]);
      });
  }
}
