import { describe, expect, it } from 'vitest';
import { senderFor } from './transport';

describe('the From header', () => {
  it("keeps our address and puts the firm's name in front of it", () => {
    expect(senderFor('Lapwing <no-reply@lapwing.test>', 'Cedar Hollow Trim Co.')).toEqual({ name: 'Cedar Hollow Trim Co.', address: 'no-reply@lapwing.test' });
    expect(senderFor('no-reply@lapwing.test', 'Northgate Wallworks')).toEqual({ name: 'Northgate Wallworks', address: 'no-reply@lapwing.test' });
  });

  it('is the configured sender as is when no name is given', () => {
    expect(senderFor('Lapwing <no-reply@lapwing.test>', undefined)).toBe('Lapwing <no-reply@lapwing.test>');
  });
});
