import { describe, expect, it } from 'vitest';
import { fuelAdvice, fuelFit, makeWords } from '@/lib/vehicle-fuel';

// Fuel types as the government vehicle enquiry service writes them (from memory of its public
// API documentation). A charge point serves battery-electric and plug-in hybrid cars
// (OZEV's chargepoint grant guidance, from memory); the record cannot tell a plug-in hybrid from
// a self-charging one, so a hybrid gets a question, not a verdict.

describe('fuelFit', () => {
  it.each([
    ['ELECTRICITY', 'electric'],
    ['HYBRID ELECTRIC', 'hybrid'],
    ['ELECTRIC DIESEL', 'hybrid'],
    ['PETROL', 'not-electric'],
    ['DIESEL', 'not-electric'],
    ['GAS BI-FUEL', 'not-electric'],
    ['', 'unknown'],
    [null, 'unknown'],
  ])('%j → %s', (fuel, fit) => {
    expect(fuelFit(fuel)).toBe(fit);
  });
});

describe('fuelAdvice', () => {
  it('says nothing for an electric car', () => {
    expect(fuelAdvice('ELECTRICITY', 'GW29 EVA')).toBeNull();
  });
  it('asks "Is this the right car?" in plain words for petrol, naming the plate and fuel', () => {
    const words = fuelAdvice('PETROL', 'GW29 PET')!;
    expect(words).toContain('Is this the right car?');
    expect(words).toContain('GW29 PET');
    expect(words).toContain('petrol');
  });
  it('asks about a hybrid without calling it wrong', () => {
    expect(fuelAdvice('HYBRID ELECTRIC', 'GW29 PHV')).toMatch(/hybrid electric.*plug-in hybrids.*Is this the right car\?/);
  });
});

it('makeWords reads a maker written in capitals', () => {
  expect(makeWords('LARKSPUR')).toBe('Larkspur');
  expect(makeWords('OSTREL-VANE MOTORS')).toBe('Ostrel-Vane Motors');
});
