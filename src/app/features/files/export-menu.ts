import { Component, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDividerModule } from '@angular/material/divider';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatSnackBar } from '@angular/material/snack-bar';
import { switchMap, of, map, type Observable } from 'rxjs';
import type { MapQuantityName, RunExportFormat } from '../../../../shared/api';
import { Api } from '../../core/api';
import type { Id } from '../../core/api-types';
import { errorMessage } from '../../core/error-message';
import { fileStem, saveBlob } from './download';

interface LatestRun {
  id: Id;
  revision: number;
}

const MAPS: Array<{ quantity: MapQuantityName; label: string }> = [
  { quantity: 'potential', label: 'Potential' },
  { quantity: 'fieldStrength', label: 'Field strength' },
  { quantity: 'speed', label: 'Speed' },
  { quantity: 'vorticity', label: 'Vorticity' },
  { quantity: 'pressure', label: 'Pressure' },
  { quantity: 'streamfunction', label: 'Streamfunction' },
];

/**
 * Export: the outline for the mask (SVG, DXF) and, from the newest saved run, the PDF report, the results as CSV,
 * the fields as VTK and any map as PNG or SVG. Files come from the server as attachments.
 */
@Component({
  selector: 'osm-export-menu',
  imports: [MatButtonModule, MatIconModule, MatMenuModule, MatDividerModule],
  template: `
    <button matButton type="button" [matMenuTriggerFor]="menu" (menuOpened)="findRun()" data-testid="export-menu"><mat-icon>download</mat-icon>Export</button>
    <mat-menu #menu="matMenu">
      <button mat-menu-item type="button" (click)="outline('svg')" data-testid="export-outline-svg"><mat-icon>polyline</mat-icon>Outline for the mask (SVG)</button>
      <button mat-menu-item type="button" (click)="outline('dxf')" data-testid="export-outline-dxf"><mat-icon>polyline</mat-icon>Outline for the mask (DXF)</button>
      <mat-divider />
      @if (run(); as r) {
        <div class="menu-note" mat-menu-item disabled>Newest saved run: revision {{ r.revision }}, run {{ r.id }}</div>
        <button mat-menu-item type="button" (click)="report(r)" data-testid="export-report"><mat-icon>picture_as_pdf</mat-icon>Run report (PDF)</button>
        <button mat-menu-item type="button" (click)="runFile(r, 'csv')" data-testid="export-csv"><mat-icon>table</mat-icon>Port table and probes (CSV)</button>
        <button mat-menu-item type="button" (click)="runFile(r, 'vtk')" data-testid="export-vtk"><mat-icon>grid_on</mat-icon>Fields (VTK)</button>
        <button mat-menu-item type="button" [matMenuTriggerFor]="png"><mat-icon>image</mat-icon>Map (PNG)</button>
        <button mat-menu-item type="button" [matMenuTriggerFor]="svg"><mat-icon>image</mat-icon>Map with colour bar (SVG)</button>
      } @else {
        <div class="menu-note" mat-menu-item disabled>{{ looking() ? 'Looking for a saved run…' : 'No saved run yet: save one on the Fields tab' }}</div>
      }
    </mat-menu>
    <mat-menu #png="matMenu">
      @for (m of maps; track m.quantity) {
        <button mat-menu-item type="button" (click)="runFile(run()!, 'png', m.quantity)">{{ m.label }}</button>
      }
    </mat-menu>
    <mat-menu #svg="matMenu">
      @for (m of maps; track m.quantity) {
        <button mat-menu-item type="button" (click)="runFile(run()!, 'svg', m.quantity)">{{ m.label }}</button>
      }
    </mat-menu>
  `,
  styles: `.menu-note { font-size: 12px; }`,
})
export class ExportMenu {
  private readonly api = inject(Api);
  private readonly snack = inject(MatSnackBar);
  readonly designId = input.required<Id>();
  readonly designName = input<string>('design');

  protected readonly maps = MAPS;
  protected readonly run = signal<LatestRun | null>(null);
  protected readonly looking = signal(false);

  protected findRun(): void {
    this.looking.set(true);
    this.api
      .revisions(this.designId())
      .pipe(
        switchMap((revs): Observable<LatestRun | null> =>
          revs.length === 0 ? of(null) : this.api.runs(revs[0].id).pipe(map((runs) => (runs.length ? { id: runs[0].id, revision: revs[0].number } : null))),
        ),
      )
      .subscribe({
        next: (r) => {
          this.run.set(r);
          this.looking.set(false);
        },
        error: () => this.looking.set(false),
      });
  }

  private save(blob$: Observable<Blob>, name: string): void {
    blob$.subscribe({
      next: (blob) => saveBlob(blob, name),
      error: (e: unknown) => this.snack.open(`Export failed: ${errorMessage(e)}`, 'Close', { duration: 8000 }),
    });
  }

  protected outline(format: 'svg' | 'dxf'): void {
    this.save(this.api.outlineFile(this.designId(), format), `${fileStem(this.designName())} outline.${format}`);
  }

  protected report(r: LatestRun): void {
    this.save(this.api.runReport(r.id), `${fileStem(this.designName())} r${r.revision} report.pdf`);
  }

  protected runFile(r: LatestRun, format: RunExportFormat, quantity?: MapQuantityName): void {
    const suffix = quantity ? ` ${quantity}` : '';
    this.save(this.api.runExport(r.id, format, quantity), `${fileStem(this.designName())} r${r.revision}${suffix}.${format}`);
  }
}
