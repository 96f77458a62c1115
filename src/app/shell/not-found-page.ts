import { ChangeDetectionStrategy, Component } from '@angular/core';
import { RouterLink } from '@angular/router';

@Component({
  selector: 'ecl-not-found-page',
  imports: [RouterLink],
  template: `
    <section class="ecl-page">
      <h1>Not found</h1>
      <p>There is nothing at this address, or it belongs to a workspace you are not a member of.</p>
      <p><a routerLink="/">Go to your workspace</a></p>
    </section>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotFoundPage {}
