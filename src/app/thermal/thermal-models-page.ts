// The thermal models of one mission of the workspace, chosen with ?mission=; thermal engineers and
// owners start a new model here (one node to begin with) and go on in the editor.
import { ChangeDetectionStrategy, Component, Injector, afterNextRender, computed, inject, input, linkedSignal, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatIcon } from '@angular/material/icon';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import { catchError, combineLatest, concat, map, of, switchMap } from 'rxjs';
import { apiErrorMessage } from '../api/api-error-message';
import { loaded } from '../api/loaded';
import { CaseApi } from '../cases/case-api';
import { DesignCaution } from '../shell/design-caution';
import { CurrentWorkspace } from '../workspace/current-workspace';
import { firstMissionWithModels } from './first-mission-with-models';
import { ThermalModelApi } from './thermal-api';
import { UtcTimePipe } from '../time/utc-time-pipe';

@Component({
  selector: 'ecl-thermal-models-page',
  imports: [UtcTimePipe, RouterLink, MatTableModule, MatFormField, MatLabel, MatInput, MatSelect, MatOption, MatButton, MatIcon, DesignCaution],
  template: `
    <section class="ecl-page">
      <h1>Thermal models</h1>
      <p class="ecl-muted">
        Lumped-node models of a mission's spacecraft: nodes, couplings, heaters and coolant loops, run on the mission's hot and cold load cases.
      </p>
      @let ms = missions();
      @if (ms.status === 'failed') {
        <p class="ecl-error" role="alert">{{ ms.message }}</p>
      } @else if (ms.status === 'ready') {
        <div class="row">
          <mat-form-field appearance="outline" class="mission-pick">
            <mat-label>Mission</mat-label>
            <mat-select [value]="chosen()" (valueChange)="choose($event)" data-testid="thermal-mission">
              @for (m of ms.value; track m.id) {
                <mat-option [value]="m.id">{{ m.name }}</mat-option>
              }
            </mat-select>
          </mat-form-field>
          @if (canEdit() && chosen()) {
            @if (naming()) {
              <!-- Nothing is saved until the model has a name and the engineer asks for it. -->
              <form class="new-model" novalidate (submit)="$event.preventDefault(); createModel(newName.value)">
                <mat-form-field appearance="outline">
                  <mat-label>New model's name</mat-label>
                  <input matInput #newName required maxlength="120" autocomplete="off" data-testid="new-model-name" />
                </mat-form-field>
                <button mat-flat-button type="submit" [disabled]="creating()" data-testid="new-model-create">Create</button>
                <button mat-button type="button" (click)="naming.set(false)">Cancel</button>
              </form>
            } @else {
              <button mat-flat-button type="button" (click)="startNaming()" data-testid="new-model"><mat-icon>add</mat-icon>New model</button>
            }
          }
        </div>
        @if (failure(); as f) {
          <p class="ecl-error" role="alert">{{ f }}</p>
        }
        @let list = models();
        @if (list.status === 'failed') {
          <p class="ecl-error" role="alert">{{ list.message }}</p>
        } @else if (list.status === 'ready') {
          @if (list.value.length === 0) {
            <p class="ecl-muted">No thermal models for this mission yet.</p>
          } @else {
            <div class="ecl-table-wrap">
              <table mat-table [dataSource]="list.value" data-testid="thermal-models">
                <ng-container matColumnDef="name">
                  <th mat-header-cell *matHeaderCellDef>Model</th>
                  <td mat-cell *matCellDef="let m"><a [routerLink]="['/w', workspaceId(), 'thermal', m.id]">{{ m.name }}</a></td>
                </ng-container>
                <ng-container matColumnDef="nodes">
                  <th mat-header-cell *matHeaderCellDef class="num">Nodes</th>
                  <td mat-cell *matCellDef="let m" class="num">{{ m.nodeCount }}</td>
                </ng-container>
                <ng-container matColumnDef="heaters">
                  <th mat-header-cell *matHeaderCellDef class="num">Heaters</th>
                  <td mat-cell *matCellDef="let m" class="num">{{ m.heaterCount }}</td>
                </ng-container>
                <ng-container matColumnDef="by">
                  <th mat-header-cell *matHeaderCellDef>Created by</th>
                  <td mat-cell *matCellDef="let m">{{ m.createdBy?.name ?? '—' }}</td>
                </ng-container>
                <ng-container matColumnDef="updated">
                  <th mat-header-cell *matHeaderCellDef>Changed</th>
                  <td mat-cell *matCellDef="let m" class="ecl-nowrap">{{ m.updatedAt | utc: 'minute' }}</td>
                </ng-container>
                <tr mat-header-row *matHeaderRowDef="columns"></tr>
                <tr mat-row *matRowDef="let row; columns: columns"></tr>
              </table>
            </div>
          }
        } @else {
          <p class="ecl-muted">Loading models…</p>
        }
      } @else {
        <p class="ecl-muted">Loading missions…</p>
      }
      <ecl-design-caution [crewed]="true" />
    </section>
  `,
  styles: `
    .row { display: flex; flex-wrap: wrap; gap: 12px; align-items: center; }
    .mission-pick { min-width: 320px; }
    .new-model { display: flex; flex-wrap: wrap; gap: 8px; align-items: center; }
    .num { text-align: right; }
    table { width: 100%; }
    ecl-design-caution { display: block; margin-top: 24px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ThermalModelsPage {
  readonly workspaceId = input.required<string>();
  /** ?mission= chooses the mission; otherwise the first with a model, else the workspace's first. */
  readonly mission = input<string | undefined>(undefined);

  private readonly cases = inject(CaseApi);
  private readonly api = inject(ThermalModelApi);
  private readonly router = inject(Router);
  private readonly role = inject(CurrentWorkspace).role;

  protected readonly columns = ['name', 'nodes', 'heaters', 'by', 'updated'];
  protected readonly canEdit = computed(() => this.role() === 'thermal' || this.role() === 'owner');
  protected readonly creating = signal(false);
  protected readonly failure = signal<string | null>(null);

  protected readonly missions = toSignal(toObservable(this.workspaceId).pipe(switchMap((id) => this.cases.missions(id).pipe(loaded()))), {
    initialValue: { status: 'loading' as const },
  });
  private readonly picked = linkedSignal(() => this.mission() ?? null);
  /** Without ?mission=, the first mission that has a model (asked one at a time); 'asking' meanwhile. */
  private readonly withModels = toSignal(
    toObservable(this.missions).pipe(
      switchMap((ms) => {
        if (ms.status !== 'ready' || this.mission()) return of(null);
        const count = (id: string) => this.api.list(id).pipe(map((items) => items.length), catchError(() => of(0)));
        return concat(of('asking' as const), firstMissionWithModels(ms.value.map((m) => m.id), count));
      }),
    ),
    { initialValue: null },
  );
  protected readonly chosen = computed(() => {
    const ms = this.missions();
    const list = ms.status === 'ready' ? ms.value : [];
    const picked = this.picked();
    const found = this.withModels();
    if (!list.some((m) => m.id === picked) && found === 'asking') return null;
    return list.find((m) => m.id === picked)?.id ?? list.find((m) => m.id === found)?.id ?? list[0]?.id ?? null;
  });
  private readonly injector = inject(Injector);
  private readonly reload = signal(0);
  protected readonly models = toSignal(
    combineLatest([toObservable(this.chosen), toObservable(this.reload)]).pipe(
      switchMap(([id]) => (id ? this.api.list(id).pipe(loaded()) : of({ status: 'loading' as const }))),
    ),
    { initialValue: { status: 'loading' as const } },
  );

  protected choose(missionId: string): void {
    this.picked.set(missionId);
    void this.router.navigate([], { queryParams: { mission: missionId }, replaceUrl: true });
  }

  /** "New model" asks for the name first; the record is written only by createModel. */
  protected readonly naming = signal(false);

  protected startNaming(): void {
    this.naming.set(true);
    this.failure.set(null);
    afterNextRender(() => document.querySelector<HTMLInputElement>('[data-testid="new-model-name"]')?.focus(), { injector: this.injector });
  }

  protected createModel(typedName: string): void {
    const missionId = this.chosen();
    const name = typedName.trim();
    if (!missionId) return;
    if (name === '') {
      this.failure.set('Give the new model a name.');
      return;
    }
    this.creating.set(true);
    this.failure.set(null);
    const model = { nodes: [{ name: 'node 1', capacitanceJK: 1000, initialC: 20 }] };
    this.api.create(missionId, { name, model }).subscribe({
      next: (created) => void this.router.navigate(['/w', this.workspaceId(), 'thermal', created.id]),
      error: (e: unknown) => {
        this.creating.set(false);
        this.failure.set(apiErrorMessage(e));
      },
    });
  }
}
