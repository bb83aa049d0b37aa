import { FocusMonitor } from '@angular/cdk/a11y';
import { Directive, ElementRef, inject } from '@angular/core';
import { MatTooltip } from '@angular/material/tooltip';

/**
 * A column header's explanation as a MatTooltip on the header cell: shown on hover, and on keyboard
 * focus of anything inside the header (a sort header's focusable part is an inner element).
 * MatTooltip follows focus through the CDK FocusMonitor on its host; asking that monitor to watch
 * the host's children too (monitor(element, true) upgrades the one shared watch) lets MatTooltip's
 * own handling open and close it, so no second show() can race it. The board's tests check both ways.
 */
@Directive({
  selector: '[kcColumnHint]',
  hostDirectives: [{ directive: MatTooltip, inputs: ['matTooltip: kcColumnHint'] }],
})
export class ColumnHint {
  constructor() {
    // MatTooltip stops the watch when it is destroyed, together with this directive.
    inject(FocusMonitor).monitor(inject(ElementRef<HTMLElement>), true);
  }
}
