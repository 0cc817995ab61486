import type { VolumeUnit } from '@shared/units/volume-units';

/**
 * What the rows said about units, collected while staging: meters whose own unit was used (the file named none),
 * and meters whose file unit differs from the unit they are set up in. Both are reported, never silent.
 */
export class UnitFindings {
  readonly meterUnitUsed = new Set<number>();
  readonly differing = new Map<number, Set<VolumeUnit>>();
  private lastMeter = -1;

  usedMeterUnit(meterId: number): void {
    if (meterId === this.lastMeter) return;
    this.lastMeter = meterId;
    this.meterUnitUsed.add(meterId);
  }

  fileUnitDiffers(meterId: number, unit: VolumeUnit): void {
    let units = this.differing.get(meterId);
    if (!units) this.differing.set(meterId, (units = new Set()));
    units.add(unit);
  }
}
