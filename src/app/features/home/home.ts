import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { catchError, map, of } from 'rxjs';
import type { HealthResponse } from '../../../../shared/api';
import { SOLVER } from '../../core/solver-client';

/** The landing screen: what Osmolane is for, and whether the server and the solver worker answer. */
@Component({
  selector: 'osm-home',
  imports: [MatCardModule, MatIconModule],
  templateUrl: './home.html',
  styleUrl: './home.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Home {
  private readonly solver = inject(SOLVER);

  protected readonly health = toSignal(
    inject(HttpClient)
      .get<HealthResponse>('/api/health')
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
