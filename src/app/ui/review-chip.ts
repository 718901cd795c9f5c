import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatChipsModule } from '@angular/material/chips';
import { MatIconModule } from '@angular/material/icon';
import type { ReviewState } from '../core/api-types';

const ICONS: Record<ReviewState, string> = { draft: 'edit_note', 'in review': 'rate_review', 'mask-ready': 'verified' };

/** The review state of a design as a small chip: draft, in review, mask-ready. */
@Component({
  selector: 'osm-review-chip',
  imports: [MatChipsModule, MatIconModule],
  template: `
    <mat-chip-set [attr.aria-label]="'Review state: ' + state()">
      <mat-chip [class]="'review-' + slug()" [disableRipple]="true" [highlighted]="state() !== 'draft'" data-testid="review-chip">
        <mat-icon matChipAvatar aria-hidden="true">{{ icon() }}</mat-icon>{{ state() }}
      </mat-chip>
    </mat-chip-set>
  `,
  styles: `
    :host { display: inline-block; }
    mat-chip { --mat-chip-container-height: 24px; --mat-chip-label-text-size: 12px; --mat-chip-with-avatar-avatar-size: 16px; }
    .review-draft { --mat-chip-elevated-container-color: var(--mat-sys-surface-container-high); }
    .review-in-review {
      --mat-chip-elevated-selected-container-color: var(--mat-sys-tertiary-container);
      --mat-chip-selected-label-text-color: var(--mat-sys-on-tertiary-container);
      --mat-chip-with-icon-selected-icon-color: var(--mat-sys-on-tertiary-container);
    }
    .review-mask-ready {
      --mat-chip-elevated-selected-container-color: var(--mat-sys-primary-container);
      --mat-chip-selected-label-text-color: var(--mat-sys-on-primary-container);
      --mat-chip-with-icon-selected-icon-color: var(--mat-sys-on-primary-container);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewChip {
  readonly state = input.required<ReviewState>();
  protected readonly slug = computed(() => this.state().replace(' ', '-'));
  protected readonly icon = computed(() => ICONS[this.state()] ?? 'help');
}
