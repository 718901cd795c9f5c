import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { Api } from '../../core/api';
import { queryPage } from '../../core/query-page';
import { WorkspaceContext } from '../../core/workspace-context';

/** The workspace's activity log, newest first, a page at a time. */
@Component({
  selector: 'osm-activity-log',
  imports: [DatePipe, RouterLink, MatTableModule, MatPaginatorModule, MatProgressBarModule, MatIconModule],
  templateUrl: './activity-log.html',
  styleUrl: './activity-log.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ActivityLog {
  private readonly api = inject(Api);
  protected readonly context = inject(WorkspaceContext);

  protected readonly columns = ['createdAt', 'actor', 'message', 'design'];
  protected readonly pageSizes = [25, 50, 100];
  private readonly query = signal({ wid: null as string | number | null, pageIndex: 0, pageSize: 50 });
  protected readonly pageIndex = computed(() => this.query().pageIndex);
  protected readonly pageSize = computed(() => this.query().pageSize);
  private readonly list = queryPage(this.query, (q) =>
    q.wid === null ? null : this.api.activity(q.wid, { limit: q.pageSize, offset: q.pageIndex * q.pageSize }),
  );
  protected readonly page = this.list.page;
  protected readonly loading = this.list.loading;
  protected readonly error = this.list.error;

  constructor() {
    const wid = computed(() => this.context.current()?.id ?? null);
    toObservable(wid)
      .pipe(takeUntilDestroyed())
      .subscribe((id) => this.query.update((q) => ({ ...q, wid: id, pageIndex: 0 })));
  }

  protected onPage(event: PageEvent): void {
    this.query.update((q) => ({ ...q, pageIndex: event.pageIndex, pageSize: event.pageSize }));
  }
}
