// The customer's gap list reads as plain, grammatical sentences: "an order agreement" (the article
// follows the sound of the next word — English usage), items joined with "and", the appliances
// asked as one, and each field in the customer's words from the vocabulary.
import { describe, expect, it } from 'vitest';
import { customerGaps } from '@/lib/gaps';

describe('customerGaps', () => {
  it('asks for an order agreement with “an”, and for a meter photo with “a”', () => {
    const texts = customerGaps({ vehicle: { condition: 'new' } }, []).map((g) => g.text);
    expect(texts).toContain('Upload an order agreement for the car.');
    expect(texts).toContain('Upload a photo of your electricity meter.');
  });

  it('lists a section’s missing fields as a sentence, naming the appliances once', () => {
    const supply = customerGaps({ supply: { mainFuseAmps: 100, looped: 'no', consumerUnitLocation: 'Hall', earthing: 'pme', phases: 'single' } }, []).find((g) => g.section === 'supply')!;
    expect(supply.text).toBe('Your supply: add the MPAN (the 13-digit supply number on your electricity bill) and the big electrical appliances in the home, and how many socket circuits there are.');
  });

  it('never shows a field’s id', () => {
    const texts = customerGaps({}, []).map((g) => g.text).join('\n');
    expect(texts).not.toMatch(/\b(fullName|mpanCore|chargePort|cableRunMetres|socketCircuits)\b/);
  });
});
