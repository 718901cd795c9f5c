import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { PortResult } from '../../../../shared/result';
import { QuantityPipe } from '../../ui/quantity-pipe';
import { formatQuantity, type Dimension } from '../../ui/units';
import { currentBalance, flowBalance } from './shown-solve';

export interface PortRow extends PortResult {
  name: string;
  floating: boolean;
}

/**
 * The port table: potential, current, flow rate and the mean speed in the channel leg each port feeds, with the
 * sums that Kirchhoff and mass balance make zero. Current and flow rate count positive INTO the fluid through
 * the port (physics.md §2-3); the mean speed is a magnitude. Runs stored before the mean speed existed show –.
 */
@Component({
  selector: 'osm-port-table',
  imports: [MatTableModule, MatTooltipModule, QuantityPipe],
  template: `
    <table mat-table [dataSource]="ports()" class="dense-table" aria-label="Ports: potential, current, flow rate and mean speed" data-testid="port-results">
      <ng-container matColumnDef="port">
        <th mat-header-cell *matHeaderCellDef>Port</th>
        <td mat-cell *matCellDef="let p" [matTooltip]="p.name" class="id">{{ p.id }}</td>
        <td mat-footer-cell *matFooterCellDef>Σ</td>
      </ng-container>
      <ng-container matColumnDef="potential">
        <th mat-header-cell *matHeaderCellDef class="num">Potential</th>
        <td mat-cell *matCellDef="let p" class="num" data-testid="port-potential">
          {{ p.potential | quantity: 'potential' : 4 }}@if (p.floating) {<span class="muted" matTooltip="Floating: no electrode; its potential is what the solve found"> fl.</span>}
        </td>
        <td mat-footer-cell *matFooterCellDef></td>
      </ng-container>
      <ng-container matColumnDef="current">
        <th mat-header-cell *matHeaderCellDef class="num" matTooltip="Positive when current enters the fluid through the port">Current</th>
        <td mat-cell *matCellDef="let p" class="num" data-testid="port-current" [attr.data-value]="p.current">{{ p.current | quantity: 'current' : 4 }}</td>
        <td mat-footer-cell *matFooterCellDef class="num" data-testid="current-sum" [attr.data-value]="currents().sum" [matTooltip]="balanceNote(currents(), 'current')">{{ balanceText(currents(), 'current') }}</td>
      </ng-container>
      <ng-container matColumnDef="flowRate">
        <th mat-header-cell *matHeaderCellDef class="num" matTooltip="Flow rate, positive when liquid enters the fluid through the port">Flow</th>
        <td mat-cell *matCellDef="let p" class="num" data-testid="port-flow">{{ p.flowRate | quantity: 'flowRate' : 4 }}</td>
        <td mat-footer-cell *matFooterCellDef class="num" data-testid="flow-sum" [matTooltip]="balanceNote(flows(), 'flowRate')">{{ balanceText(flows(), 'flowRate') }}</td>
      </ng-container>
      <ng-container matColumnDef="meanSpeed">
        <th mat-header-cell *matHeaderCellDef class="num" matTooltip="Mean speed in the channel leg the port feeds: |flow rate| / (port width × depth)">Speed</th>
        <td mat-cell *matCellDef="let p" class="num" data-testid="port-mean-speed" [attr.data-value]="p.meanSpeed ?? null">{{ p.meanSpeed | quantity: 'velocity' : 3 }}</td>
        <td mat-footer-cell *matFooterCellDef></td>
      </ng-container>
      <tr mat-header-row *matHeaderRowDef="columns"></tr>
      <tr mat-row *matRowDef="let row; columns: columns" data-testid="port-row"></tr>
      <tr mat-footer-row *matFooterRowDef="columns" class="sum"></tr>
    </table>
    <p class="caption muted">
      Current and flow rate count positive <strong>into</strong> the fluid through the port, negative out of it; Σ is
      zero up to the solver's tolerance (Kirchhoff, mass balance). Speed is the mean speed in the channel leg the
      port feeds; – where a stored run predates it.
    </p>
  `,
  styles: `
    /* Five columns in the side panel; a narrower window scrolls the table sideways rather than clipping it. */
    :host { display: block; overflow-x: auto; }
    table { font-size: 12.5px; }
    .mat-mdc-table .mat-mdc-row, .mat-mdc-table .mat-mdc-header-row, .mat-mdc-table .mat-mdc-footer-row { height: 30px; }
    .mat-mdc-cell, .mat-mdc-header-cell, .mat-mdc-footer-cell { padding: 0 4px; white-space: nowrap; }
    .mat-mdc-cell:first-of-type, .mat-mdc-header-cell:first-of-type, .mat-mdc-footer-cell:first-of-type { padding-left: 6px; }
    .num { text-align: right; font-variant-numeric: tabular-nums; }
    .id { font-weight: 600; }
    .sum td { font-weight: 500; border-top: 1px solid var(--mat-sys-outline); }
    .caption { font-size: 12px; margin: 4px 0 0; line-height: 1.35; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PortTable {
  readonly ports = input.required<PortRow[]>();
  protected readonly columns = ['port', 'potential', 'current', 'flowRate', 'meanSpeed'];
  protected readonly currents = computed(() => currentBalance(this.ports()));
  protected readonly flows = computed(() => flowBalance(this.ports()));

  /** Σ as "≈ 0" when it is below a millionth of the largest term (rounding), else the value. */
  protected balanceText(b: { sum: number; largest: number }, dimension: Dimension): string {
    if (!(b.largest > 0)) return formatQuantity(0, dimension);
    return Math.abs(b.sum) <= BALANCE_SHARE * b.largest ? '≈ 0' : formatQuantity(b.sum, dimension, { digits: 3 });
  }

  protected balanceNote(b: { sum: number; largest: number }, dimension: Dimension): string {
    if (!(b.largest > 0)) return 'Nothing flows';
    const share = Math.abs(b.sum) / b.largest;
    return `Σ = ${formatQuantity(b.sum, dimension, { digits: 3 })}, ${share.toExponential(1)} of the largest port's`;
  }
}

/** Sums below this share of the largest term are shown as zero. */
export const BALANCE_SHARE = 1e-6;
