import { describe, expect, it } from 'vitest';
import { placeFieldErrors } from '../../src/components/form/use-schema-form';

describe('where a refusal’s messages are shown', () => {
  it('puts each message on its field when the form shows that field', () => {
    expect(
      placeFieldErrors({ email: ['Use an e-mail address'], password: ['Too short'] }, new Set(['email', 'password'])),
    ).toEqual({
      above: null,
      onFields: [
        ['email', 'Use an e-mail address'],
        ['password', 'Too short'],
      ],
    });
  });

  it('says above the form what is for the whole form or for a field the form has no input for', () => {
    const placed = placeFieldErrors(
      { _: ['That book is no longer on sale'], email: ['Taken'], role: ['Pick player or teacher'] },
      new Set(['email']),
    );
    expect(placed.onFields).toEqual([['email', 'Taken']]);
    expect(placed.above).toBe('That book is no longer on sale Pick player or teacher');
  });

  it('joins several messages of one field', () => {
    expect(placeFieldErrors({ tempo: ['Too slow', 'Whole numbers only'] }, new Set(['tempo'])).onFields).toEqual([
      ['tempo', 'Too slow Whole numbers only'],
    ]);
  });
});
