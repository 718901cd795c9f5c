import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { Api } from '../../core/api';
import type { MailSummary } from '../../core/api-types';
import { problemOf } from '../../core/error-message';

/** The development mailbox: mail the local server captured instead of sending (not in production). */
@Component({
  selector: 'osm-mailbox',
  imports: [DatePipe, RouterLink, MatTableModule, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './mailbox.html',
  styleUrl: './mailbox.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Mailbox {
  private readonly api = inject(Api);

  protected readonly columns = ['date', 'to', 'subject'];
  protected readonly mails = signal<MailSummary[]>([]);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);

  constructor() {
    this.load();
  }

  protected load(): void {
    this.loading.set(true);
    this.error.set(null);
    this.api.mailbox().subscribe({
      next: (list) => {
        this.mails.set([...list].sort((a, b) => String(b.date).localeCompare(String(a.date))));
        this.loading.set(false);
      },
      error: (err: unknown) => {
        this.loading.set(false);
        const problem = problemOf(err);
        this.error.set(problem.status === 404 ? 'The mailbox exists only on a development server; this server sends real mail.' : problem.message);
      },
    });
  }
}
