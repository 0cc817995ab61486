import type { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';
import { PLANT_FACTOR_RANGES, type PlantWaterUseCategory } from '@shared/budgets/hydrozone';

const isBlank = (v: unknown) => v === null || v === undefined || v === '';

/** A number strictly above zero (area, flows); blank is left to `required`. */
export const positive: ValidatorFn = (c) => (isBlank(c.value) || Number(c.value) > 0 ? null : { positive: true });

/** Irrigation efficiency: above 0 and at most 1, as the engine requires. */
export const efficiency: ValidatorFn = (c) =>
  isBlank(c.value) || (Number(c.value) > 0 && Number(c.value) <= 1) ? null : { efficiency: true };

/** Plant factor 0..1 on its own control. */
export const plantFactorRange: ValidatorFn = (c) =>
  isBlank(c.value) || (Number(c.value) >= 0 && Number(c.value) <= 1) ? null : { plantFactorRange: true };

/**
 * Form-level rules that involve two fields: a category or a factor is needed; a factor must fall in its
 * category's MWELO range; a special landscape area names its kind; emitters come as count and gph together.
 * Errors are set on the field the user should fix, so each message appears under it.
 */
export const hydrozoneRules: ValidatorFn = (group: AbstractControl): ValidationErrors | null => {
  const get = (name: string) => group.get(name)!;
  const category = get('plantWaterUse').value as PlantWaterUseCategory | '';
  const factor = get('plantFactor');
  setRuleError(factor, 'needsFactor', !category && isBlank(factor.value));
  const range = category ? PLANT_FACTOR_RANGES[category] : null;
  const outside =
    !!range && !isBlank(factor.value) && (Number(factor.value) < range.min || Number(factor.value) > range.max);
  setRuleError(factor, 'outsideCategory', outside);
  setRuleError(
    get('specialLandscapeKind'),
    'kindRequired',
    get('specialLandscapeArea').value === true && !get('specialLandscapeKind').value,
  );
  const count = get('emitterCount');
  const gph = get('emitterGph');
  setRuleError(gph, 'pairRequired', !isBlank(count.value) && isBlank(gph.value));
  setRuleError(count, 'pairRequired', isBlank(count.value) && !isBlank(gph.value));
  return null;
};

function setRuleError(control: AbstractControl, key: string, on: boolean): void {
  const errors = { ...(control.errors ?? {}) };
  if (on) errors[key] = true;
  else delete errors[key];
  control.setErrors(Object.keys(errors).length ? errors : null);
}
