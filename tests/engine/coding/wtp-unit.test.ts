/**
 * WTP_k = −β_k/β_cost is money of the cost attribute per one-unit change of coded column k
 * (Train 2009, Discrete Choice Methods with Simulation, 2nd ed., §2.5 and §6.3): the unit text
 * must name the money and the change that column codes (dummy: against the reference level;
 * effects: against the average level; a constant: all else equal).
 */
import { describe, expect, it } from 'vitest';
import { getMoneyUnit, getWtpUnit } from '../../../shared/engine/coding/wtp-unit';
import { makeStudyDefinition } from '../../../scripts/lib/study-factory/definition';

describe('getWtpUnit', () => {
  const def = makeStudyDefinition();

  it('names the money of the cost attribute', () => {
    expect(getMoneyUnit(def)).toBe('€ of monthly bill increase');
  });

  it('says per one unit of a linear column, without doubling its unit', () => {
    expect(getWtpUnit(def, 'attr:interrupt')).toBe(
      '€ of monthly bill increase per +1 in Supply interruptions per year',
    );
  });

  it('says against which level a dummy or effects column is measured', () => {
    expect(getWtpUnit(def, 'attr:river:good')).toBe(
      '€ of monthly bill increase for River health: good instead of poor',
    );
    expect(getWtpUnit(def, 'attr:warn:w2')).toBe(
      '€ of monthly bill increase for Taste/odour warning days: 2 days against the average level',
    );
  });

  it('reads a constant as all else equal, and knows no unit for an unknown column', () => {
    expect(getWtpUnit(def, 'asc:fixed')).toBe(
      '€ of monthly bill increase for Current service, all else equal',
    );
    expect(getWtpUnit(def, 'attr:nothing')).toBeNull();
  });

  it('gives the cost column no WTP unit: it is the denominator of every WTP', () => {
    expect(getWtpUnit(def, 'attr:bill')).toBeNull();
  });

  it('falls back to cost units when the study has no cost attribute', () => {
    const noCost = makeStudyDefinition();
    noCost.attributes = noCost.attributes.filter((a) => !a.isCost);
    expect(getMoneyUnit(noCost)).toBe('cost units');
  });
});
