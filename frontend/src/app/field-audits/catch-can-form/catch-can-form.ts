import { ChangeDetectionStrategy, Component, computed, input, OnInit, output, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { CatchUnit, ThroatUnit } from '@shared/field-audits/catch-can';
import {
  AUDITED_HEAD_TYPES,
  FIELD_AUDIT_LIMITS,
  HEAD_TYPE_LABELS,
  type AuditedHeadType,
  type PressureReading,
  type ZoneTestDto,
  type ZoneTestInput,
} from '@shared/field-audits/field-audit-dto';
import { zoneTestResults } from '@shared/field-audits/zone-test-results';
import type { HydrozoneDto } from '@shared/hydrozones/hydrozone-dto';

const DEFAULT_CANS = 16;

/**
 * One catch-can test as entered at the site on a phone: the zone, how long it ran, every can's catch, pressures
 * and soil. The figures are worked out as the cans are typed in, with the same code the server uses.
 */
@Component({
  selector: 'rm-catch-can-form',
  imports: [
    FormsModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
  ],
  templateUrl: './catch-can-form.html',
  styleUrl: './catch-can-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CatchCanForm implements OnInit {
  readonly zones = input.required<HydrozoneDto[]>();
  /** An existing test to edit; empty for a new one. */
  readonly test = input<ZoneTestDto | null>(null);
  readonly busy = input(false);
  readonly problem = input<string | null>(null);
  readonly save = output<ZoneTestInput>();
  readonly cancelled = output<void>();

  protected readonly headTypes = AUDITED_HEAD_TYPES;
  protected readonly headLabels = HEAD_TYPE_LABELS;
  protected readonly maxCans = FIELD_AUDIT_LIMITS.catchesMax;

  protected readonly hydrozoneId = signal<number | null>(null);
  protected readonly headType = signal<AuditedHeadType>('spray');
  protected readonly runMinutes = signal<number | null>(15);
  protected readonly catchUnit = signal<CatchUnit>('ml');
  protected readonly throatDiameter = signal<number | null>(null);
  protected readonly throatUnit = signal<ThroatUnit>('in');
  protected readonly catches = signal<(number | null)[]>(Array(DEFAULT_CANS).fill(null));
  protected readonly pressures = signal<PressureReading[]>([]);
  protected readonly soilIntake = signal<number | null>(null);
  protected readonly slope = signal<number | null>(null);
  protected readonly notes = signal('');

  ngOnInit(): void {
    const t = this.test();
    if (!t) return;
    this.hydrozoneId.set(t.hydrozoneId);
    this.headType.set(t.headType);
    this.runMinutes.set(t.runMinutes);
    this.catchUnit.set(t.catchUnit);
    this.throatDiameter.set(t.throatDiameter);
    this.throatUnit.set(t.throatUnit ?? 'in');
    this.catches.set([...t.catches]);
    this.pressures.set(t.pressures.map((p) => ({ ...p })));
    this.soilIntake.set(t.soilIntakeInPerHour);
    this.slope.set(t.slopePercent);
    this.notes.set(t.notes);
  }

  protected readonly zoneArea = computed(() => this.zones().find((z) => z.id === this.hydrozoneId())?.areaFt2 ?? 0);

  /** What the cans say so far; a sentence instead when they can't be evaluated yet. */
  protected readonly preview = computed(() => {
    const catches = this.catches().filter((c): c is number => c !== null && Number.isFinite(c));
    const minutes = this.runMinutes();
    if (catches.length < 4 || !minutes) return { text: 'Enter at least 4 cans and the run time to see the figures.' };
    try {
      const r = zoneTestResults(
        {
          catches,
          catchUnit: this.catchUnit(),
          throatDiameter: this.catchUnit() === 'ml' ? this.throatDiameter() : null,
          throatUnit: this.throatUnit(),
          runMinutes: minutes,
          headType: this.headType(),
        },
        this.zoneArea() || 1,
      );
      return {
        text: [
          `Rate ${r.prInPerHour.toFixed(2)} in/h`,
          `DU_lq ${Math.round(100 * r.du)} % (${r.rating})`,
          `multiplier ${r.schedulingMultiplier.toFixed(2)}`,
        ].join(' · '),
        warnings: r.warnings,
      };
    } catch (err) {
      return { text: (err as Error).message };
    }
  });

  /** A new zone brings its own head type when it is one catch cans can measure. */
  protected pickZone(id: number): void {
    this.hydrozoneId.set(id);
    const method = this.zones().find((z) => z.id === id)?.irrigationMethod;
    if (method && (AUDITED_HEAD_TYPES as readonly string[]).includes(method))
      this.headType.set(method as AuditedHeadType);
  }

  protected setCanCount(value: number): void {
    const n = Math.max(4, Math.min(this.maxCans, Math.round(Number(value) || 0)));
    this.catches.update((cs) => (n > cs.length ? [...cs, ...Array(n - cs.length).fill(null)] : cs.slice(0, n)));
  }

  protected setCatch(index: number, raw: string): void {
    const value = raw.trim() === '' ? null : Number(raw);
    this.catches.update((cs) => cs.map((c, i) => (i === index ? value : c)));
  }

  protected addPressure(): void {
    this.pressures.update((ps) => [...ps, { location: '', psi: 0 }]);
  }

  protected setPressure(index: number, patch: Partial<PressureReading>): void {
    this.pressures.update((ps) => ps.map((p, i) => (i === index ? { ...p, ...patch } : p)));
  }

  protected removePressure(index: number): void {
    this.pressures.update((ps) => ps.filter((_, i) => i !== index));
  }

  protected submit(): void {
    const zoneId = this.hydrozoneId();
    if (zoneId === null) return;
    const unit = this.catchUnit();
    this.save.emit({
      hydrozoneId: zoneId,
      headType: this.headType(),
      runMinutes: Number(this.runMinutes()),
      catchUnit: unit,
      throatDiameter: unit === 'ml' ? this.throatDiameter() : null,
      throatUnit: unit === 'ml' ? this.throatUnit() : null,
      // An empty can is a zero; a can left blank was not read and is left out.
      catches: this.catches().filter((c): c is number => c !== null && Number.isFinite(c)),
      pressures: this.pressures().filter((p) => p.location.trim() !== ''),
      soilIntakeInPerHour: this.soilIntake(),
      slopePercent: this.slope(),
      notes: this.notes(),
    });
  }
}
