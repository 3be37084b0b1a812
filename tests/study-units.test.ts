import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { UnitError, differenceToSI, hasUnits, quantityToSI, valueInUnit } from '../shared/study/units.js';
import { sha256Hex } from '../shared/study/sha256.js';

describe('values with units', () => {
  it('converts temperatures with offsets to kelvin', () => {
    // SI Brochure (9th ed.), 2.3.1: T/K = t/°C + 273.15.
    expect(quantityToSI('fluid_temperature', '80 degC')).toBeCloseTo(353.15, 10);
    // NIST SP 811, B.8: T/K = (t/°F + 459.67)/1.8, so 176 °F = 353.15 K.
    expect(quantityToSI('surface_temperature', '176 degF')).toBeCloseTo(353.15, 10);
    expect(quantityToSI('fluid_temperature', '300 K')).toBe(300);
    expect(quantityToSI('fluid_temperature', 300)).toBe(300);
  });

  it('converts lengths, speeds, flow rates, fluxes and pressures to SI', () => {
    expect(quantityToSI('diameter', '25 mm')).toBeCloseTo(0.025, 15);
    expect(quantityToSI('velocity', '2 m/s')).toBe(2);
    // 1 L = 1e-3 m³ (SI Brochure, Table 8), so 1.5 L/min = 1.5e-3/60 m³/s.
    expect(quantityToSI('flow_rate', '1.5 L/min')).toBeCloseTo(2.5e-5, 18);
    expect(quantityToSI('heat_flux', '5 kW/m^2')).toBeCloseTo(5000, 9);
    // 1 bar = 1e5 Pa (SI Brochure, Table 8).
    expect(quantityToSI('pressure', '1 bar')).toBeCloseTo(1e5, 6);
    // 1 in = 0.0254 m exactly (international yard and pound, 1959).
    expect(quantityToSI('length', '1 in')).toBeCloseTo(0.0254, 15);
  });

  it('rejects a wrong dimension with the expected unit in the message', () => {
    expect(() => quantityToSI('diameter', '2 kg')).toThrow(UnitError);
    expect(() => quantityToSI('diameter', '2 kg')).toThrow(/wrong dimension: expected a value convertible to m/);
    expect(() => quantityToSI('fluid_temperature', '25 mm')).toThrow(/convertible to K/);
    expect(() => quantityToSI('velocity', '2 m')).toThrow(/convertible to m\/s/);
  });

  it('rejects unreadable strings, units without a number and numbers without units', () => {
    expect(() => quantityToSI('diameter', 'wide')).toThrow(/cannot read 'wide'/);
    expect(() => quantityToSI('diameter', 'mm')).toThrow(/has a unit but no number/);
    expect(() => quantityToSI('diameter', '25')).toThrow(/without units/);
  });

  it('rejects temperatures below absolute zero', () => {
    expect(() => quantityToSI('fluid_temperature', '-300 degC')).toThrow(/below absolute zero/);
    expect(() => quantityToSI('fluid_temperature', -5)).toThrow(/below absolute zero/);
  });

  it('treats sweep steps as differences: no temperature offset', () => {
    expect(differenceToSI('fluid_temperature', '10 degC')).toBeCloseTo(10, 10);
    // 9 °F difference = 5 K (NIST SP 811, B.8: 1 °F = 5/9 K as an interval).
    expect(differenceToSI('fluid_temperature', '9 degF')).toBeCloseTo(5, 10);
    expect(differenceToSI('diameter', '5 mm')).toBeCloseTo(0.005, 15);
    expect(() => differenceToSI('diameter', '5 s')).toThrow(/wrong dimension/);
  });

  it('converts fluid properties to their SI units', () => {
    expect(valueInUnit('J/(kg K)', '4.18 kJ/(kg*K)')).toBeCloseTo(4180, 9);
    expect(valueInUnit('Pa s', '1.0 mPa s')).toBeCloseTo(1e-3, 15);
    expect(valueInUnit('K^-1', '3.4e-3 /K')).toBeCloseTo(3.4e-3, 15);
    expect(() => valueInUnit('kg/m^3', '998 kg/m^2')).toThrow(/wrong dimension/);
  });

  it('tells strings with units from plain words', () => {
    expect(hasUnits('1e5 m')).toBe(true);
    expect(hasUnits('staggered')).toBe(false);
    expect(hasUnits('5')).toBe(false);
  });
});

describe('sha256Hex', () => {
  it('matches the FIPS 180-2 examples', () => {
    // FIPS 180-2, Appendix B.1 and B.2.
    expect(sha256Hex('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect(sha256Hex('abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq')).toBe(
      '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1',
    );
  });

  it('matches node:crypto across block boundaries and non-ASCII text', () => {
    const samples = ['', 'x', 'name: café-Δ 25 °C\n', ...[55, 56, 63, 64, 65, 119, 120, 1000].map((n) => 'a'.repeat(n))];
    for (const s of samples) expect(sha256Hex(s)).toBe(createHash('sha256').update(s, 'utf8').digest('hex'));
  });
});
