import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTabsModule } from '@angular/material/tabs';
import { MatTooltipModule } from '@angular/material/tooltip';
import { Title } from '@angular/platform-browser';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { Subject, debounceTime, firstValueFrom } from 'rxjs';
import { Api } from '../../core/api';
import type { Design, DesignDocument, ReviewState, RevisionSummary, Role } from '../../core/api-types';
import { errorMessage, problemOf } from '../../core/error-message';
import type { LeaveCheck } from '../../core/guards';
import { ROLE_LABELS, canEdit, reviewTransitions } from '../../core/roles';
import { WorkspaceContext } from '../../core/workspace-context';
import { ConfirmDialog, type ConfirmData } from '../../ui/confirm-dialog';
import { ReviewChip } from '../../ui/review-chip';
import { CompareTab } from '../compare/compare-tab';
import { ConditionsPanel } from '../conditions/conditions-panel';
import { DoubleLayerTab } from '../double-layer/double-layer-tab';
import { FieldsView } from '../fields/fields-view';
import { ExportMenu } from '../files/export-menu';
import { HistoryTab } from '../history/history-tab';
import { PlannerTab } from '../planner/planner-tab';
import { SketchEditor } from '../sketch/sketch-editor';
import { SweepsTab } from '../sweeps/sweeps-tab';
import { TracerTab } from '../tracer/tracer-tab';
import { ConflictDialog, type ConflictChoice, type ConflictData } from './conflict-dialog';
import { sameDocument } from './same-document';
import { SaveRevisionDialog, type SaveRevisionData } from './save-revision-dialog';

/** Tabs of the design page, in order, as `?tab=` names them (later issues add Compare, Tracer, Planner, ...). */
export const DESIGN_TABS = ['sketch', 'conditions', 'fields', 'compare', 'tracer', 'planner', 'double-layer', 'sweeps', 'history'] as const;
export type DesignTab = (typeof DESIGN_TABS)[number];

/** Quiet time after the last edit before the draft is saved. */
export const AUTOSAVE_DELAY_MS = 1200;

export type SaveState = 'saved' | 'pending' | 'saving' | 'conflict' | 'failed';

/**
 * The design page (/designs/:id): loads the design, holds the working document, autosaves the draft with the
 * optimistic version (a conflict always asks), saves revisions, moves the review state as the role allows, and
 * hosts the Sketch, Conditions, Fields, Compare, Tracer, Planner, Double layer, Sweeps and History tabs. Viewers and reviewers see the document read-only.
 */
@Component({
  selector: 'osm-design-page',
  imports: [
    RouterLink,
    MatTabsModule,
    MatButtonModule,
    MatIconModule,
    MatMenuModule,
    MatProgressBarModule,
    MatTooltipModule,
    ReviewChip,
    SketchEditor,
    ConditionsPanel,
    FieldsView,
    CompareTab,
    TracerTab,
    PlannerTab,
    DoubleLayerTab,
    SweepsTab,
    HistoryTab,
    ExportMenu,
  ],
  templateUrl: './design-page.html',
  styleUrl: './design-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: {
    '(window:beforeunload)': 'onBeforeUnload($event)',
    '(document:keydown.control.s)': 'onSaveKey($event)',
    '(document:keydown.meta.s)': 'onSaveKey($event)',
  },
})
export class DesignPage implements LeaveCheck {
  private readonly api = inject(Api);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly dialog = inject(MatDialog);
  private readonly snack = inject(MatSnackBar);
  private readonly context = inject(WorkspaceContext);
  private readonly title = inject(Title);

  /** Route parameter `:id`. */
  readonly id = input.required<string>();
  /** Query parameter: the open tab. */
  readonly tab = input<string>();
  /** Query parameter: the run the Fields tab shows (kept while on Fields). */
  readonly run = input<string>();

  protected readonly design = signal<Design | null>(null);
  protected readonly loadError = signal<string | null>(null);
  /** The working document: what the tabs show and edit. */
  protected readonly document = signal<DesignDocument | null>(null);
  protected readonly saveState = signal<SaveState>('saved');
  protected readonly saveError = signal<string | null>(null);
  protected readonly savedAt = signal<Date | null>(null);
  protected readonly revisions = signal<RevisionSummary[] | null>(null);
  /** Bumped when History should read again (revision saved, run stored, review moved). */
  protected readonly historyVersion = signal(0);
  /** Bumped by the header's Solve button; the Fields tab solves when it changes. */
  protected readonly solveRequest = signal(0);

  protected readonly role = computed<Role | null>(() => {
    const d = this.design();
    if (!d) return null;
    if (d.role) return d.role;
    const ws = this.context.workspaces()?.find((w) => String(w.id) === String(d.workspaceId));
    return ws?.role ?? this.context.role();
  });
  protected readonly roleLabel = computed(() => {
    const role = this.role();
    return role ? ROLE_LABELS[role] : '';
  });
  protected readonly readOnly = computed(() => !canEdit(this.role()));
  protected readonly transitions = computed(() => {
    const d = this.design();
    return d ? reviewTransitions(this.role(), d.reviewState) : [];
  });
  protected readonly tabIndex = computed(() => Math.max(0, DESIGN_TABS.indexOf((this.tab() ?? 'sketch') as DesignTab)));
  protected readonly workspaceId = computed(() => this.design()?.workspaceId ?? this.context.current()?.id ?? null);

  protected readonly latest = computed(() => this.revisions()?.[0] ?? null);
  private readonly latestDocument = signal<{ id: RevisionSummary['id']; document: DesignDocument } | null>(null);
  /** True when the working document is exactly the latest revision's, so runs can be stored against it. */
  protected readonly matchesLatest = computed(() => {
    const latest = this.latest();
    const frozen = this.latestDocument();
    return !!latest && !!frozen && frozen.id === latest.id && sameDocument(this.document(), frozen.document);
  });
  protected readonly fieldsRevisionId = computed(() => (this.matchesLatest() ? this.latest()!.id : null));

  /** The document as the server holds it at `version`. */
  private base: DesignDocument | null = null;
  private version = 0;
  private dirty = false;
  private inFlight: Promise<boolean> | null = null;
  private readonly edits = new Subject<void>();

  constructor() {
    effect(() => {
      const id = this.id();
      untracked(() => this.load(id));
    });
    this.edits.pipe(debounceTime(AUTOSAVE_DELAY_MS), takeUntilDestroyed()).subscribe(() => void this.save());
  }

  // ---- loading

  private load(id: string): void {
    this.design.set(null);
    this.document.set(null);
    this.loadError.set(null);
    this.revisions.set(null);
    this.latestDocument.set(null);
    this.api.design(id).subscribe({
      next: (design) => {
        this.take(design);
        if (design.workspaceId != null) {
          const wid = design.workspaceId;
          this.context.load().subscribe({ next: () => this.context.select(wid), error: () => undefined });
        }
        this.loadRevisions();
      },
      error: (err: unknown) => {
        const problem = problemOf(err);
        this.loadError.set(problem.status === 404 ? 'This design does not exist, or it is not in a workspace of yours.' : problem.message);
      },
    });
  }

  /** Makes `design` (as the server has it) the working copy. */
  private take(design: Design): void {
    this.title.setTitle(`${design.name} · Osmolane`);
    this.design.set(design);
    this.document.set(design.document);
    this.base = design.document;
    this.version = design.version;
    this.dirty = false;
    this.saveState.set('saved');
    this.saveError.set(null);
  }

  private loadRevisions(): void {
    this.api.revisions(this.id()).subscribe({
      next: (list) => {
        this.revisions.set(list);
        const latest = list[0];
        if (!latest) return;
        if (this.latestDocument()?.id === latest.id) return;
        this.api.revision(latest.id).subscribe({
          next: (rev) => this.latestDocument.set({ id: rev.id, document: rev.document }),
          error: () => undefined,
        });
      },
      error: () => this.revisions.set([]),
    });
  }

  // ---- editing and autosave

  protected onDocumentChange(document: DesignDocument): void {
    if (this.readOnly()) return;
    this.document.set(document);
    this.dirty = true;
    if (this.saveState() !== 'conflict') this.saveState.set('pending');
    this.edits.next();
  }

  /**
   * Saves the draft now if it has unsaved changes. Resolves true when everything is saved; false on a conflict
   * (the conflict dialog is then open) or a failure (shown beside the save state).
   */
  protected save(): Promise<boolean> {
    if (this.inFlight) return this.inFlight.then((ok) => (ok ? this.save() : false));
    if (!this.dirty || this.readOnly()) return Promise.resolve(!this.dirty);
    if (this.saveState() === 'conflict') return Promise.resolve(false);
    const sent = this.document()!;
    this.dirty = false;
    this.saveState.set('saving');
    this.inFlight = new Promise<boolean>((resolve) => {
      this.api.saveDesign(this.id(), sent, this.version).subscribe({
        next: (saved) => {
          this.inFlight = null;
          this.version = saved.version;
          this.base = sent;
          this.design.update((d) => (d ? { ...d, ...saved, document: sent, role: saved.role ?? d.role } : d));
          this.savedAt.set(new Date());
          this.saveError.set(null);
          this.saveState.set(this.dirty ? 'pending' : 'saved');
          if (this.dirty) this.edits.next();
          resolve(true);
        },
        error: (err: unknown) => {
          this.inFlight = null;
          this.dirty = true;
          const problem = problemOf(err);
          if (problem.status === 409) {
            this.saveState.set('conflict');
            void this.resolveConflict();
          } else {
            this.saveState.set('failed');
            this.saveError.set(problem.message);
          }
          resolve(false);
        },
      });
    });
    return this.inFlight;
  }

  protected saveNow(): void {
    if (this.saveState() === 'conflict') {
      void this.resolveConflict();
      return;
    }
    if (this.saveState() === 'failed') this.saveState.set('pending');
    void this.save();
  }

  private conflictOpen = false;

  /** Someone saved first: show what happened and let the person choose. Nothing is overwritten silently. */
  private async resolveConflict(): Promise<void> {
    if (this.conflictOpen) return;
    this.conflictOpen = true;
    try {
      let theirs: Design;
      try {
        theirs = await firstValueFrom(this.api.design(this.id()));
      } catch (err) {
        this.saveError.set(`Someone saved first, and their version could not be read: ${errorMessage(err)}`);
        return;
      }
      const choice = await firstValueFrom(
        this.dialog
          .open<ConflictDialog, ConflictData, ConflictChoice>(ConflictDialog, {
            data: { theirs, mayWrite: !this.readOnly() },
            disableClose: true,
            width: '560px',
          })
          .afterClosed(),
      );
      if (choice === 'overwrite') {
        this.version = theirs.version;
        this.base = theirs.document;
        this.saveState.set('pending');
        this.conflictOpen = false;
        if (await this.save()) this.snack.open('Your version is saved over theirs.', undefined, { duration: 4000 });
      } else if (choice === 'copy') {
        await this.saveAsCopy(theirs);
      } else {
        this.take(theirs);
        this.snack.open('Their version is open now; your unsaved changes were dropped.', undefined, { duration: 5000 });
      }
    } finally {
      this.conflictOpen = false;
    }
  }

  private async saveAsCopy(theirs: Design): Promise<void> {
    const wid = this.workspaceId();
    const mine = this.document();
    if (wid === null || !mine) return;
    const name = `${theirs.name} (my copy)`.slice(0, 200);
    try {
      const copy = await firstValueFrom(this.api.createDesign(wid, name, { ...mine, name }));
      this.take(theirs); // this design keeps their version; nothing of mine is left unsaved here
      this.snack.open(`Saved yours as “${name}”.`, undefined, { duration: 5000 });
      await this.router.navigate(['/designs', String(copy.id)]);
    } catch (err) {
      this.saveState.set('conflict');
      this.saveError.set(`The copy could not be saved: ${errorMessage(err)}`);
    }
  }

  // ---- revisions, runs, review

  /** Asks for a note and freezes the (saved) document as a revision. */
  protected async saveRevision(reason?: string): Promise<boolean> {
    if (this.readOnly()) return false;
    if (!(await this.save())) {
      this.snack.open('Save the draft first (see the save state above).', 'Close', { duration: 6000 });
      return false;
    }
    const latest = this.latest();
    const note = await firstValueFrom(
      this.dialog
        .open<SaveRevisionDialog, SaveRevisionData, string>(SaveRevisionDialog, {
          data: { next: latest ? latest.number + 1 : this.revisions() ? 1 : null, reason },
          width: '480px',
        })
        .afterClosed(),
    );
    if (!note) return false;
    const frozen = this.document()!;
    try {
      const created = await firstValueFrom(this.api.saveRevision(this.id(), note));
      this.latestDocument.set({ id: created.id, document: frozen });
      this.snack.open(`Revision ${created.number} saved.`, undefined, { duration: 4000 });
      this.loadRevisions();
      this.historyVersion.update((v) => v + 1);
      return true;
    } catch (err) {
      this.snack.open(errorMessage(err), 'Close', { duration: 8000 });
      return false;
    }
  }

  /** Solve from any tab: the Fields tab opens and solves the working document. */
  protected solveFromPage(): void {
    this.solveRequest.update((v) => v + 1);
    this.selectTab(DESIGN_TABS.indexOf('fields'));
  }

  protected onRunSaved(): void {
    this.historyVersion.update((v) => v + 1);
  }

  protected setReview(to: ReviewState): void {
    this.api.setReviewState(this.id(), to).subscribe({
      next: (updated) => {
        // Take the new version only when the server's document is the one this page started from.
        if (updated.document && this.base && sameDocument(updated.document as DesignDocument, this.base)) this.version = updated.version;
        this.design.update((d) => (d ? { ...d, reviewState: updated.reviewState ?? to } : d));
        const words = to === 'in review' ? 'In review; the reviewers get a mail.' : to === 'mask-ready' ? 'Approved as mask-ready.' : 'Back to draft.';
        this.snack.open(words, undefined, { duration: 4000 });
        this.historyVersion.update((v) => v + 1);
      },
      error: (err: unknown) => this.snack.open(errorMessage(err), 'Close', { duration: 8000 }),
    });
  }

  // ---- tabs and leaving

  protected selectTab(index: number): void {
    const tab = DESIGN_TABS[index] ?? 'sketch';
    void this.router.navigate([], {
      relativeTo: this.route,
      queryParams: { tab: tab === 'sketch' ? null : tab, run: tab === 'fields' ? (this.run() ?? null) : null },
      queryParamsHandling: 'merge',
      replaceUrl: true,
    });
  }

  async mayLeave(): Promise<boolean> {
    if (!this.dirty && !this.inFlight) return true;
    if (await this.save()) return true;
    const leave = await firstValueFrom(
      this.dialog
        .open<ConfirmDialog, ConfirmData, boolean>(ConfirmDialog, {
          data: {
            title: 'Leave without saving?',
            message: 'Your latest changes to this design are not saved. They are lost if you leave now.',
            confirm: 'Leave',
            cancel: 'Stay',
          },
        })
        .afterClosed(),
    );
    return leave === true;
  }

  protected onBeforeUnload(event: BeforeUnloadEvent): void {
    if (this.dirty || this.inFlight) event.preventDefault();
  }

  protected onSaveKey(event: Event): void {
    event.preventDefault();
    this.saveNow();
  }
}
