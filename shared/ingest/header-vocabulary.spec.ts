import { describe, expect, it } from 'vitest';
import { classifyHeader, unitFromText } from './header-vocabulary';

describe('classifyHeader', () => {
  it.each([
    ['Meter #', 'meter'],
    ['Serial', 'meter'],
    ['Meter Serial', 'meter'],
    ['Read Date', 'date'],
    ['Usage (Gal)', 'usageValue'],
    ['Consumption CCF', 'usageValue'],
    ['Interval Start', 'start'],
    ['Hr 01', 'interval-slot'],
    ['Hr 24', 'interval-slot'],
    ['00:15', 'interval-slot'],
    ['24:00', 'interval-slot'],
    ['HE 7', 'interval-slot'],
    ['Station', 'station'],
    ['Zone', 'station'],
    ['Run Time (min)', 'duration'],
    ['Register Reading', 'registerValue'],
    ['Meter Reading', 'registerValue'],
    ['Controller ID', 'controller'],
    ['Flow (gal)', 'measuredGallons'],
    ['Interval (min)', 'intervalMinutes'],
    ['Unit', 'unit'],
    ['Cause', 'cause'],
    ['End Time', 'end'],
    ['Time', 'time'],
    ['Timestamp', 'timestamp'],
    ['\uFEFFMeter', 'meter'],
    ['Note', 'other'],
    ['Colour', 'other'],
  ])('%j → %s', (header, role) => {
    expect(classifyHeader(header)).toBe(role);
  });
});

describe('unitFromText', () => {
  it.each([
    ['Usage (CCF)', 'ccf'],
    ['Consumption CCF', 'ccf'],
    ['HCF', 'ccf'],
    ['Usage (Gal)', 'gal'],
    ['Gallons', 'gal'],
    ['kgal', 'kgal'],
    ['Volume (ft3)', 'ft3'],
    ['Volume (m³)', 'm3'],
    ['Use (acre-ft)', 'acre-ft'],
    ['Cubic Feet', 'ft3'],
    ['acre-inch', 'acre-in'],
    ['Usage', null],
    ['Hr 01', null],
  ])('%j → %s', (text, unit) => {
    expect(unitFromText(text)).toBe(unit);
  });
});
