import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { Router } from '@angular/router';
import { EMPTY, Subscription, catchError, defer, retry, scan, timer } from 'rxjs';
import type { SweepDetail, SweepRequest, SweepSummary } from '../../../../shared/api';
import { Api } from '../../core/api';
import type { Id, RevisionSummary, Role } from '../../core/api-types';
import { errorMessage } from '../../core/error-message';
import { canEdit } from '../../core/roles';
import { SweepForm } from './sweep-form';
import { applySweepEvent, isFinished } from './sweep-state';
import { SweepView } from './sweep-view';

/**
 * The Sweeps tab: the design's sweeps (newest first), a form to start one (editors and owners), and the chosen
 * sweep, followed live through its event stream until it finishes.
 */
@Component({
  selector: 'osm-sweeps-tab',
  imports: [DatePipe, MatButtonModule, MatIconModule, MatProgressBarModule, MatTableModule, SweepForm, SweepView],
  templateUrl: './sweeps-tab.html',
  styleUrl: './sweeps-tab.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SweepsTab {
  private readonly api = inject(Api);
  private readonly router = inject(Router);
  private readonly snack = inject(MatSnackBar);

  readonly designId = input.required<Id>();
  readonly role = input<Role | null>(null);
  /** Changes when revisions may have changed (a revision was saved). */
  readonly refresh = input(0);

  protected readonly mayEdit = computed(() => canEdit(this.role()));
  protected readonly revisions = signal<RevisionSummary[] | null>(null);
  protected readonly sweeps = signal<SweepSummary[] | null>(null);
  protected readonly selectedId = signal<Id | null>(null);
  protected readonly current = signal<SweepDetail | null>(null);
  protected readonly defining = signal(false);
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly columns = ['status', 'what', 'points', 'method', 'created'];
  private watching: Subscription | null = null;

  constructor() {
    effect(() => {
      const id = this.designId();
      this.refresh();
      untracked(() => this.load(id));
    });
    inject(DestroyRef).onDestroy(() => this.watching?.unsubscribe());
  }

  private load(designId: Id): void {
    this.api.revisions(designId).subscribe({ next: (r) => this.revisions.set(r), error: () => this.revisions.set([]) });
    this.api.sweeps(designId).subscribe({
      next: (list) => {
        this.sweeps.set(list);
        if (this.selectedId() === null && list[0]) this.open(list[0].id);
        if (list.length === 0 && this.mayEdit()) this.defining.set(true);
      },
      error: (err: unknown) => {
        this.sweeps.set([]);
        this.error.set(errorMessage(err));
      },
    });
  }

  protected describe(s: SweepSummary): string {
    return s.parameters.map((p) => p.label).join(' × ');
  }

  /** Shows a sweep, following its events until it finishes (reconnecting after a dropped stream). */
  protected open(id: Id): void {
    this.selectedId.set(id);
    this.defining.set(false);
    this.watching?.unsubscribe();
    const stream = defer(() => this.api.sweepEvents(id)).pipe(
      retry({ count: 5, delay: () => timer(2000) }),
      // Without a stream (a proxy that buffers it, say), show the sweep as it is now.
      catchError(() => this.api.sweep(id).pipe(catchError(() => EMPTY))),
    );
    this.watching = stream
      .pipe(scan((s: SweepDetail | null, e) => ('type' in e ? applySweepEvent(s, e) : (e as SweepDetail)), null as SweepDetail | null))
      .subscribe((sweep) => {
        if (!sweep) return;
        this.current.set(sweep);
        this.sweeps.update((list) => list?.map((x) => (x.id === sweep.id ? { ...x, status: sweep.status, done: sweep.done, failed: sweep.failed } : x)) ?? list);
        if (isFinished(sweep.status)) this.watching?.unsubscribe();
      });
  }

  protected start(request: SweepRequest): void {
    this.busy.set(true);
    this.api.startSweep(request).subscribe({
      next: (sweep) => {
        this.busy.set(false);
        const { points: _points, ...summary } = sweep;
        this.sweeps.update((list) => [summary, ...(list ?? [])]);
        this.current.set(sweep);
        this.open(sweep.id);
      },
      error: (err: unknown) => {
        this.busy.set(false);
        this.snack.open(errorMessage(err), 'Close', { duration: 8000 });
      },
    });
  }

  protected cancel(): void {
    const id = this.selectedId();
    if (id === null) return;
    this.busy.set(true);
    this.api.cancelSweep(id).subscribe({
      next: (sweep) => {
        this.busy.set(false);
        this.current.set(sweep);
        this.sweeps.update((list) => list?.map((x) => (x.id === id ? { ...x, status: sweep.status } : x)) ?? list);
      },
      error: (err: unknown) => {
        this.busy.set(false);
        this.snack.open(errorMessage(err), 'Close', { duration: 8000 });
      },
    });
  }

  /** Opens a point as a run of the revision, in the Fields tab. */
  protected openPoint(index: number): void {
    const sweep = this.current();
    if (!sweep) return;
    const known = sweep.points[index]?.runId;
    const go = (runId: Id) => void this.router.navigate(['/designs', String(this.designId())], { queryParams: { tab: 'fields', run: runId } });
    if (known != null) return go(known);
    this.busy.set(true);
    this.api.openSweepPoint(sweep.id, index).subscribe({
      next: (run) => {
        this.busy.set(false);
        go(run.id);
      },
      error: (err: unknown) => {
        this.busy.set(false);
        this.snack.open(errorMessage(err), 'Close', { duration: 8000 });
      },
    });
  }
}
