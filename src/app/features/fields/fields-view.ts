import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import type { DesignDocument } from '../../core/api-types';

/** The Fields tab: solve the working document in the worker, read the maps, ports and warnings, save the run. */
@Component({
  selector: 'osm-fields-view',
  template: `<p class="muted">Fields: solve the design to see its maps.</p>`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FieldsView {
  /** The working document to solve. */
  readonly document = input.required<DesignDocument>();
  /** The revision a saved run belongs to; null while the document differs from the latest revision. */
  readonly revisionId = input<string | number | null>(null);
  readonly readOnly = input(false);
  /** A run was stored (History reads again). */
  readonly runSaved = output<void>();
}
