import { Component, input, output } from '@angular/core';
import type { DesignDocument } from '../../../../../shared/design';

/**
 * Stand-ins for the design page's tab contents in unit tests: the same selectors, inputs and outputs as the
 * real Sketch, Conditions, Fields, Compare, Tracer, Planner, Double layer and Sweeps components, and nothing else.
 */
@Component({ selector: 'osm-sketch-editor', template: '<p>{{ readOnly() ? "read-only" : "editable" }}</p>' })
export class SketchEditor {
  readonly document = input.required<DesignDocument>();
  readonly readOnly = input(false);
  readonly documentChange = output<DesignDocument>();
}

@Component({ selector: 'osm-conditions-panel', template: '<p>{{ readOnly() ? "read-only" : "editable" }}</p>' })
export class ConditionsPanel {
  readonly document = input.required<DesignDocument>();
  readonly readOnly = input(false);
  readonly documentChange = output<DesignDocument>();
}

@Component({ selector: 'osm-fields-view', template: '<p>revision {{ revisionId() ?? "none" }}</p>' })
export class FieldsView {
  readonly document = input.required<DesignDocument>();
  readonly revisionId = input<string | number | null>(null);
  readonly readOnly = input(false);
  readonly runId = input<string | number | null>(null);
  readonly solveRequest = input(0);
  readonly runSaved = output<void>();
}

@Component({ selector: 'osm-sweeps-tab', template: '<p>sweeps of design {{ designId() }}</p>' })
export class SweepsTab {
  readonly designId = input.required<string | number>();
  readonly role = input<string | null>(null);
  readonly refresh = input(0);
}

@Component({ selector: 'osm-compare-tab', template: '<p>compare</p>' })
export class CompareTab {
  readonly document = input.required<DesignDocument>();
}

@Component({ selector: 'osm-tracer-tab', template: '<p>tracer</p>' })
export class TracerTab {
  readonly document = input.required<DesignDocument>();
}

@Component({ selector: 'osm-planner-tab', template: '<p>planner {{ readOnly() ? "read-only" : "editable" }}</p>' })
export class PlannerTab {
  readonly document = input.required<DesignDocument>();
  readonly readOnly = input(false);
  readonly documentChange = output<DesignDocument>();
}

@Component({ selector: 'osm-double-layer-tab', template: '<p>double layer</p>' })
export class DoubleLayerTab {
  readonly document = input.required<DesignDocument>();
}
