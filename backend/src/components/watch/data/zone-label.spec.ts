import { describe, expect, it } from 'vitest';
import { zoneLabel } from './watch-data-repository';

describe('zoneLabel', () => {
  it('names a zone by station and name, without repeating a name that is just the station', () => {
    expect(zoneLabel('4', 'Front beds')).toBe('Station 4 “Front beds”');
    expect(zoneLabel('4', 'Station 4')).toBe('Station 4');
    expect(zoneLabel('4', '  ')).toBe('Station 4');
  });
});
