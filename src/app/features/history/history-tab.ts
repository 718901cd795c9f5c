import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Api } from '../../core/api';
import type { ActivityItem, Id, ReviewState, RevisionSummary, Role } from '../../core/api-types';
import { errorMessage } from '../../core/error-message';
import { reviewTransitions } from '../../core/roles';
import { ReviewChip } from '../../ui/review-chip';
import { RevisionPanel } from './revision-panel';

/**
 * The History tab: the review state and the moves the role allows, revisions newest first (each with its runs
 * and comments), and the design's activity.
 */
@Component({
  selector: 'osm-history-tab',
  imports: [DatePipe, MatExpansionModule, MatButtonModule, MatIconModule, MatProgressBarModule, ReviewChip, RevisionPanel],
  templateUrl: './history-tab.html',
  styleUrl: './history-tab.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HistoryTab {
  private readonly api = inject(Api);

  readonly designId = input.required<Id>();
  readonly workspaceId = input<Id | string | null>(null);
  readonly role = input<Role | null>(null);
  readonly reviewState = input.required<ReviewState>();
  /** Changes when the page wants the history read again. */
  readonly refresh = input(0);
  /** A review move the person chose. */
  readonly reviewMove = output<ReviewState>();

  protected readonly transitions = computed(() => reviewTransitions(this.role(), this.reviewState()));
  protected readonly revisions = signal<RevisionSummary[] | null>(null);
  protected readonly activity = signal<ActivityItem[]>([]);
  protected readonly activityTotal = signal(0);
  protected readonly error = signal<string | null>(null);

  constructor() {
    effect(() => {
      const id = this.designId();
      const wid = this.workspaceId();
      this.refresh();
      untracked(() => this.load(id, wid));
    });
  }

  private load(id: Id, wid: Id | string | null): void {
    this.error.set(null);
    this.api.revisions(id).subscribe({
      next: (list) => this.revisions.set(list),
      error: (err: unknown) => {
        this.revisions.set([]);
        this.error.set(errorMessage(err));
      },
    });
    if (wid !== null) {
      this.api.activity(wid, { designId: id, limit: 50 }).subscribe({
        next: (page) => {
          this.activity.set(page.items);
          this.activityTotal.set(page.total);
        },
        error: () => this.activity.set([]),
      });
    }
  }
}
