import { DEFAULT_THRESHOLDS, type ThresholdName } from '@shared/watch/alert-thresholds';
import { displayUnit, shown, THRESHOLD_GROUPS, THRESHOLD_TEXT } from './threshold-views';

describe('watch settings as people read them', () => {
  it('when the page groups the thresholds, then every one is shown once, under its alert', () => {
    const grouped = THRESHOLD_GROUPS.flatMap((g) => g.names);
    expect([...grouped].sort()).toEqual((Object.keys(DEFAULT_THRESHOLDS) as ThresholdName[]).sort());
    expect(new Set(grouped).size).toBe(grouped.length);
  });

  it('when a threshold is labelled, then no code name or provenance note reaches the screen', () => {
    for (const [name, text] of Object.entries(THRESHOLD_TEXT)) {
      expect(text.label).not.toContain(name);
      expect(`${text.label} ${text.help}`).not.toMatch(/common practice|no source|MAD|from memory/i);
    }
  });

  it('when every unit is shown, then each reads in words and metric sites see litres', () => {
    for (const spec of Object.values(DEFAULT_THRESHOLDS)) {
      expect(displayUnit(spec.unit, false).unit).not.toMatch(/^(h|min|share)$/);
      expect(displayUnit(spec.unit, true).unit).not.toMatch(/gal/);
    }
    expect(displayUnit('gal/h', true)).toEqual({ unit: 'L per hour', factor: 3.785411784 });
    expect(shown(3, displayUnit('gal/h', true).factor)).toBe(11.36);
    expect(shown(0.05, displayUnit('share', false).factor)).toBe(5);
  });
});
