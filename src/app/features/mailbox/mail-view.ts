import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { Api } from '../../core/api';
import type { MailDetail } from '../../core/api-types';
import { errorMessage } from '../../core/error-message';
import { isLink, mailParts } from './mail-text';

/** One captured mail, its plain text with working links. */
@Component({
  selector: 'osm-mail-view',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './mail-view.html',
  styleUrl: './mail-view.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MailView {
  private readonly api = inject(Api);

  /** Route parameter. */
  readonly id = input.required<string>();

  protected readonly mail = signal<MailDetail | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly parts = computed(() => mailParts(this.mail()?.text ?? ''));
  protected readonly isLink = isLink;

  constructor() {
    effect(() => {
      const id = this.id();
      untracked(() => {
        this.mail.set(null);
        this.error.set(null);
        this.api.mail(id).subscribe({
          next: (m) => this.mail.set(m),
          error: (err: unknown) => this.error.set(errorMessage(err)),
        });
      });
    });
  }
}
