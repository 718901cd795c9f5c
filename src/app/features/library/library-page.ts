import { ChangeDetectionStrategy, Component, computed, effect, inject, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { Api } from '../../core/api';
import type { LibraryItem, LibraryKind } from '../../core/api-types';
import { errorMessage } from '../../core/error-message';
import { canEdit } from '../../core/roles';
import { WorkspaceContext } from '../../core/workspace-context';
import { ConfirmDialog, type ConfirmData } from '../../ui/confirm-dialog';
import { KIND_LABELS, LIBRARY_COLUMNS, type LibraryColumn } from './library-fields';
import { LibraryItemDialog, type LibraryItemData } from './library-item-dialog';

interface Section {
  kind: LibraryKind;
  title: string;
  items: LibraryItem[];
  valueColumns: LibraryColumn[];
  columns: string[];
}

/** Buffers and wall materials: the built-in ones with their sources, and the workspace's own. */
@Component({
  selector: 'osm-library-page',
  imports: [MatTableModule, MatButtonModule, MatIconModule, MatProgressBarModule, MatTooltipModule],
  templateUrl: './library-page.html',
  styleUrl: './library-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LibraryPage {
  private readonly api = inject(Api);
  private readonly dialog = inject(MatDialog);
  private readonly snack = inject(MatSnackBar);
  protected readonly context = inject(WorkspaceContext);

  protected readonly mayEdit = computed(() => canEdit(this.context.role()));
  protected readonly items = signal<LibraryItem[]>([]);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);

  protected readonly sections = computed<Section[]>(() =>
    (['buffer', 'wall'] as const).map((kind) => {
      const items = this.items()
        .filter((i) => i.kind === kind)
        .sort((a, b) => Number(b.builtIn) - Number(a.builtIn) || a.name.localeCompare(b.name));
      const valueColumns = LIBRARY_COLUMNS[kind];
      const columns = ['name', ...valueColumns.map((c) => `v:${c.id}`), 'source', ...(this.mayEdit() ? ['actions'] : [])];
      return { kind, title: KIND_LABELS[kind], items, valueColumns, columns };
    }),
  );

  constructor() {
    effect(() => {
      if (this.context.current()) untracked(() => this.load());
    });
  }

  protected load(): void {
    const ws = this.context.current();
    if (!ws) return;
    this.loading.set(true);
    this.error.set(null);
    this.api.library(ws.id).subscribe({
      next: (items) => {
        this.items.set(items);
        this.loading.set(false);
      },
      error: (err: unknown) => {
        this.loading.set(false);
        this.error.set(errorMessage(err));
      },
    });
  }

  protected edit(kind: LibraryKind, item?: LibraryItem): void {
    const ws = this.context.current();
    if (!ws) return;
    this.dialog
      .open<LibraryItemDialog, LibraryItemData, LibraryItem>(LibraryItemDialog, { data: { workspaceId: ws.id, kind, item }, width: kind === 'wall' ? '680px' : '560px' })
      .afterClosed()
      .subscribe((saved) => {
        if (!saved) return;
        this.snack.open(`${saved.name ?? 'Item'} saved.`, undefined, { duration: 3000 });
        this.load();
      });
  }

  protected remove(item: LibraryItem): void {
    this.dialog
      .open<ConfirmDialog, ConfirmData, boolean>(ConfirmDialog, {
        data: { title: `Delete ${item.name}?`, message: 'Designs that used its values keep them; only the library entry goes.', confirm: 'Delete' },
      })
      .afterClosed()
      .subscribe((ok) => {
        if (!ok) return;
        this.api.deleteLibraryItem(item.id).subscribe({
          next: () => this.load(),
          error: (err: unknown) => this.snack.open(errorMessage(err), 'Close', { duration: 8000 }),
        });
      });
  }
}
