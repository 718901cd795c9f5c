import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { catchError, map, of } from 'rxjs';
import { Api } from '../../core/api';
import { SOLVER } from '../../core/solver-client';

/** What Osmolane is, and whether the server and the solver worker answer. */
@Component({
  selector: 'osm-about-dialog',
  imports: [MatDialogModule, MatButtonModule, MatIconModule],
  templateUrl: './about-dialog.html',
  styleUrl: './about-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AboutDialog {
  private readonly solver = inject(SOLVER);

  protected readonly health = toSignal(
    inject(Api)
      .health()
      .pipe(
        map((h) => `${h.status}, database ${h.database}, version ${h.version}`),
        catchError(() => of('not reachable')),
      ),
    { initialValue: 'checking…' },
  );

  protected readonly worker = signal('starting…');

  constructor() {
    this.solver
      .hello()
      .then((r) => this.worker.set(r.ready ? 'ready' : 'not ready'))
      .catch(() => this.worker.set('failed to start'));
  }
}
