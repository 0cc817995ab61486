import type { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';
import { SITE_LIMITS, TAG_PATTERN, isTimeZone } from '@shared/sites/site';

/** Same rule as the server: an IANA zone this runtime knows. */
export const timeZoneValidator: ValidatorFn = (control: AbstractControl<string>): ValidationErrors | null =>
  control.value && !isTimeZone(control.value) ? { timeZone: true } : null;

/** Each tag matches TAG_PATTERN and the limits in SITE_LIMITS. */
export const tagsValidator: ValidatorFn = (control: AbstractControl<string[]>): ValidationErrors | null => {
  const tags = control.value ?? [];
  if (tags.length > SITE_LIMITS.tagsMax) return { tooManyTags: { max: SITE_LIMITS.tagsMax } };
  const bad = tags.find((tag) => tag.length > SITE_LIMITS.tagMax || !TAG_PATTERN.test(tag));
  return bad ? { tag: { value: bad } } : null;
};

/** The zones offered by the autocomplete, from the browser's own list. */
export const TIME_ZONES: readonly string[] = (() => {
  try {
    return Intl.supportedValuesOf('timeZone');
  } catch {
    return [];
  }
})();
