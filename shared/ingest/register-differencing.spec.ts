import { describe, expect, it } from 'vitest';
import { differenceRegisterReads, serialSwaps, type RegisterPeriod } from './register-differencing';
import type { RegisterRecord } from './ingest-records';

const read = (day: string, value: number, meterRef = 'M'): RegisterRecord => ({
  meterRef,
  atUtc: `2026-${day}T07:00:00.000Z`,
  value,
  unit: 'ccf',
});
const register = (over: Partial<RegisterPeriod> = {}): RegisterPeriod => ({
  installedUtc: '2020-01-01T00:00:00.000Z',
  removedUtc: null,
  multiplier: 1,
  digits: 4,
  ...over,
});

describe('differenceRegisterReads', () => {
  it('consecutive reads become volumes over the span between them', () => {
    const out = differenceRegisterReads({ meterRef: 'M', registers: [register()] }, [
      read('06-01', 100),
      read('07-01', 168),
    ]);
    expect(out.volumes).toEqual([
      { meterRef: 'M', startUtc: '2026-06-01T07:00:00.000Z', minutes: 30 * 1440, volume: 68, unit: 'ccf' },
    ]);
    expect(out.problems).toEqual([]);
  });

  it('rollover: 9,998 → 0,003 on a 4-digit register is 5 units', () => {
    const out = differenceRegisterReads({ meterRef: 'M', registers: [register()] }, [
      read('06-01', 9998),
      read('07-01', 3),
    ]);
    expect(out.volumes.map((v) => v.volume)).toEqual([5]);
    expect(out.rollovers).toEqual([{ atUtc: '2026-07-01T07:00:00.000Z', from: 9998, to: 3, volume: 5 }]);
  });

  it('the multiplier scales register units to volume', () => {
    const out = differenceRegisterReads({ meterRef: 'M', registers: [register({ multiplier: 10 })] }, [
      read('06-01', 9998),
      read('07-01', 3),
    ]);
    expect(out.volumes[0]!.volume).toBe(50);
  });

  it('a drop that is not a plausible rollover is reported, not produced, and the newer read becomes the base', () => {
    const out = differenceRegisterReads({ meterRef: 'M', registers: [register()] }, [
      read('09-01', 5210),
      read('10-01', 5190),
      read('11-01', 5350),
    ]);
    expect(out.volumes.map((v) => [v.startUtc.slice(5, 10), v.volume])).toEqual([['10-01', 160]]);
    expect(out.problems).toMatchObject([{ kind: 'negative', severity: 'error', atUtc: '2026-10-01T07:00:00.000Z' }]);
  });

  it('without a digit count, any drop is reported', () => {
    const out = differenceRegisterReads({ meterRef: 'M', registers: [register({ digits: null })] }, [
      read('06-01', 9998),
      read('07-01', 3),
    ]);
    expect(out.volumes).toEqual([]);
    expect(out.problems.map((p) => p.kind)).toEqual(['negative']);
  });

  it('a meter swap: reads on different registers are not differenced; the swap-instant pair splits old/new', () => {
    const swap = '2026-08-15T15:00:00.000Z';
    const registers = [
      register({ installedUtc: '2019-05-01T00:00:00.000Z', removedUtc: swap, digits: 5 }),
      register({ installedUtc: swap, removedUtc: null, digits: 5 }),
    ];
    const reads: RegisterRecord[] = [
      read('08-01', 45266),
      { meterRef: 'M', atUtc: swap, value: 45301, unit: 'ccf' },
      { meterRef: 'M', atUtc: swap, value: 0, unit: 'ccf' },
      read('09-01', 61),
    ];
    const out = differenceRegisterReads({ meterRef: 'M', registers }, reads);
    expect(out.volumes.map((v) => v.volume)).toEqual([35, 61]);
    expect(out.problems).toMatchObject([{ kind: 'meter-swap', severity: 'notice', atUtc: swap }]);
  });

  it(
    'a read after removal with no new register, an oversize read, ' + 'a duplicate and an unsorted read are reported',
    () => {
      const registers = [register({ removedUtc: '2026-10-15T00:00:00.000Z' })];
      const out = differenceRegisterReads({ meterRef: 'M', registers }, [
        read('06-01', 100),
        read('06-01', 101),
        read('05-01', 90),
        read('07-01', 12345),
        read('08-01', 150),
        read('11-01', 160),
        read('08-02', 151, 'OTHER'),
      ]);
      expect(out.problems.map((p) => p.kind)).toEqual([
        'duplicate',
        'not-sorted',
        'too-many-digits',
        'outside-install',
        'other-meter',
      ]);
      expect(out.volumes.map((v) => v.volume)).toEqual([50]);
    },
  );

  it('a unit change between reads is not differenced', () => {
    const out = differenceRegisterReads({ meterRef: 'M', registers: [register()] }, [
      read('06-01', 1),
      { ...read('07-01', 2), unit: 'gal' },
    ]);
    expect(out.volumes).toEqual([]);
    expect(out.problems.map((p) => p.kind)).toEqual(['unit-changed']);
  });

  it('a multiplier and digits read from the file win over the meter settings (a ×10 dial is not a rollover)', () => {
    const x10 = (day: string, value: number) => ({ ...read(day, value), multiplier: 10, digits: 5 });
    const out = differenceRegisterReads({ meterRef: 'M', registers: [register({ digits: 4 })] }, [
      x10('06-01', 9950),
      x10('07-01', 10012),
    ]);
    expect(out.problems).toEqual([]);
    expect(out.volumes.map((v) => v.volume)).toEqual([620]);
  });

  it('a serial change is a swap: each serial is differenced on its own, usage across it counted once', () => {
    const on = (serial: string, day: string, value: number, hour = '07') => ({
      ...read(day, value),
      atUtc: `2026-${day}T${hour}:00:00.000Z`,
      serial,
    });
    const reads = [on('A-1', '06-01', 4500), on('A-1', '07-01', 4610), on('B-2', '07-01', 2), on('B-2', '08-01', 98)];
    const out = differenceRegisterReads({ meterRef: 'M', registers: [register()] }, reads);
    expect(out.volumes.map((v) => v.volume)).toEqual([110, 96]);
    expect(out.problems.map((p) => [p.kind, p.severity])).toEqual([['meter-swap', 'notice']]);
    expect(serialSwaps(reads)).toMatchObject([{ fromSerial: 'A-1', toSerial: 'B-2', initialReadUtc: reads[2]!.atUtc }]);
  });

  it('a volume with an estimated read at either end is estimated', () => {
    const out = differenceRegisterReads({ meterRef: 'M', registers: [register()] }, [
      read('06-01', 100),
      { ...read('07-01', 150), estimated: true },
      read('08-01', 210),
    ]);
    expect(out.volumes.map((v) => v.estimated ?? false)).toEqual([true, true]);
  });
});
