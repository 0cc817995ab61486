import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { HEAD_TYPE_LABELS, type ZoneTestDto } from '@shared/field-audits/field-audit-dto';

/** One zone's test: what the cans said and the run times that follow. */
@Component({
  selector: 'rm-zone-test-card',
  imports: [DecimalPipe, MatButtonModule, MatIconModule],
  template: `
    @let t = test();
    <article class="zone" [attr.aria-label]="'Zone test: ' + t.hydrozoneName">
      <h4>
        {{ t.hydrozoneName }}
        <span class="sub">· {{ headLabels[t.headType] }} · {{ t.catches.length }} cans · {{ t.runMinutes }} min</span>
      </h4>
      @if (t.results; as r) {
        <dl class="figures">
          <div>
            <dt>Rate</dt>
            <dd>{{ r.prInPerHour | number: '1.2-2' }} in/h</dd>
          </div>
          <div>
            <dt>DU<sub>lq</sub></dt>
            <dd [class]="r.rating">{{ r.du * 100 | number: '1.0-0' }} % ({{ r.rating }})</dd>
          </div>
          <div>
            <dt>Multiplier</dt>
            <dd>{{ r.schedulingMultiplier | number: '1.2-2' }}</dd>
          </div>
          <div>
            <dt>Audited efficiency</dt>
            <dd>{{ r.auditedEfficiency | number: '1.2-2' }}</dd>
          </div>
        </dl>
        @for (w of r.warnings; track w) {
          <p class="warning">{{ w }}</p>
        }
      }
      @if (t.schedule; as s) {
        <dl class="figures">
          <div>
            <dt>Need per week</dt>
            <dd>{{ s.neededMinutesPerWeek | number: '1.0-0' }} min</dd>
          </div>
          <div>
            <dt>Budget allows</dt>
            <dd [class.poor]="!s.budgetCoversNeed">{{ s.budgetMinutesPerWeek | number: '1.0-0' }} min</dd>
          </div>
          <div>
            <dt>Per watering day</dt>
            <dd>{{ s.minutesPerWateringDay | number: '1.0-0' }} min</dd>
          </div>
          <div>
            <dt>Cycles</dt>
            <dd>
              @if (s.cycleSoak; as c) {
                {{ c.cycles }} × {{ c.minutesPerCycle | number: '1.0-1' }} min
              } @else {
                one run
              }
            </dd>
          </div>
        </dl>
        <ul class="cautions">
          @for (c of s.cautions; track c) {
            <li>{{ c }}</li>
          }
        </ul>
      }
      @if (t.problem) {
        <p class="warning">{{ t.problem }}</p>
      }
      @if (t.pressures.length) {
        <p class="sub">
          Pressures:
          @for (p of t.pressures; track $index) {
            <span class="pressure">{{ p.location }} {{ p.psi }} psi</span>
          }
        </p>
      }
      <div class="actions">
        @if (canApply() && t.results && t.hydrozoneId !== null) {
          <button mat-stroked-button type="button" (click)="applyResults.emit(t)">
            <mat-icon>input</mat-icon> {{ t.appliedAt ? 'Written to hydrozone · again' : 'Write to hydrozone' }}
          </button>
        }
        @if (canEdit()) {
          <button mat-button type="button" (click)="edit.emit(t)">Edit</button>
          <button mat-button type="button" (click)="remove.emit(t)">Delete</button>
        }
      </div>
    </article>
  `,
  styles: `
    .zone {
      border-bottom: 1px solid var(--mat-sys-outline-variant);
      padding: 12px 0;
    }
    h4 {
      margin: 0 0 8px;
      font: var(--mat-sys-title-medium);
      overflow-wrap: anywhere;
    }
    .sub {
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-medium);
    }
    .figures {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(140px, 1fr));
      gap: 8px 16px;
      margin: 0 0 8px;
      div {
        display: flex;
        flex-direction: column;
      }
      dt {
        color: var(--mat-sys-on-surface-variant);
        font-size: 0.8rem;
      }
      dd {
        margin: 0;
        font-weight: 600;
      }
    }
    .poor {
      color: var(--mat-sys-error);
    }
    .warning {
      color: var(--mat-sys-error);
      margin: 0 0 6px;
    }
    .cautions {
      margin: 0 0 8px;
      padding-left: 20px;
      color: var(--mat-sys-on-surface-variant);
    }
    .pressure + .pressure::before {
      content: ' · ';
    }
    .actions {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ZoneTestCard {
  readonly test = input.required<ZoneTestDto>();
  readonly canEdit = input(false);
  readonly canApply = input(false);
  readonly applyResults = output<ZoneTestDto>();
  readonly edit = output<ZoneTestDto>();
  readonly remove = output<ZoneTestDto>();
  protected readonly headLabels = HEAD_TYPE_LABELS;
}
