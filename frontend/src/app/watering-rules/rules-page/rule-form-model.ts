import type { WateringRuleDto, WateringRuleInput } from '@shared/watering-rules/watering-rule';

/** A new rule as the form starts it: evenings and early mornings, 15 minutes a station, from today. */
export function blankRule(): WateringRuleInput {
  return {
    name: '',
    stage: 'Stage 1',
    dayMode: 'weekdays',
    weekdays: [1, 3, 5],
    allowedHours: { startHour: 20, endHour: 8 },
    maxStationMinutes: 15,
    inForceFrom: new Date().toISOString().slice(0, 10),
    inForceTo: null,
    sites: [],
  };
}

export function toInput(rule: WateringRuleDto): WateringRuleInput {
  return {
    name: rule.name,
    stage: rule.stage,
    dayMode: rule.dayMode,
    weekdays: [...rule.weekdays],
    allowedHours: { ...rule.allowedHours },
    maxStationMinutes: rule.maxStationMinutes,
    inForceFrom: rule.inForceFrom,
    inForceTo: rule.inForceTo,
    sites: rule.sites.map((s) => ({
      siteId: s.siteId,
      addressNumber: s.addressNumber,
      assignedWeekdays: [...s.assignedWeekdays],
    })),
  };
}
