import { effectiveIrrigationEfficiency, effectivePlantFactor } from '@shared/budgets/hydrozone';
import type { PlanZone } from '@shared/planner/plan-zones';
import { engineZone, type HydrozonesService } from '../../hydrozones/domain/hydrozones-service';

/** The site's hydrozones as the planner sees them (effective plant factor and efficiency). */
export class PlanZones {
  constructor(private readonly hydrozones: HydrozonesService) {}

  async ofSite(siteId: number): Promise<PlanZone[]> {
    return (await this.hydrozones.allOfSite(siteId)).map((r) => {
      const zone = engineZone(r);
      return {
        id: r.id,
        name: r.name,
        areaFt2: r.areaFt2,
        plantFactor: effectivePlantFactor(zone),
        irrigationMethod: r.irrigationMethod,
        efficiency: effectiveIrrigationEfficiency(zone).efficiency,
        specialLandscapeArea: r.specialLandscapeArea,
      };
    });
  }
}
