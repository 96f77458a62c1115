import { ChangeDetectionStrategy, Component } from '@angular/core';
import { DesignCaution } from '../shell/design-caution';

/** Placeholder until the lumped-node model editor lands; the route and its role rule are in place. */
@Component({
  selector: 'ecl-thermal-models-page',
  imports: [DesignCaution],
  template: `
    <section class="ecl-page">
      <h1>Thermal models</h1>
      <p class="ecl-muted">
        Lumped-node models (nodes, couplings, heaters with thermostats) arrive with a coming release. Thermal engineers and
        owners will build and run them here.
      </p>
      <ecl-design-caution />
    </section>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ThermalModelsPage {}
