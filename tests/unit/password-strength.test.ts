import { dictionary } from '@zxcvbn-ts/language-common';
import { describe, expect, it } from 'vitest';
import { isStrongPassword } from '../../shared/password-strength';
import { SignUpSchema } from '../../shared/schemas/sign-up';

describe('the shared password rule', () => {
  it('refuses passwords from the common-password list shipped with @zxcvbn-ts/language-common', () => {
    const common = dictionary['passwords-common'];
    // Both appear on that list (checked here rather than from memory).
    expect(common).toEqual(expect.arrayContaining(['password123', '1234567890']));
    for (const p of ['password123', '1234567890', 'qwertyuiop', 'iloveyou12', 'Password1234']) expect(isStrongPassword(p), p).toBe(false);
    // Every list entry long enough for the length rule is refused too (a sample across the list).
    const longOnes = common.filter((p) => p.length >= 10);
    for (let i = 0; i < longOnes.length; i += Math.ceil(longOnes.length / 50)) expect(isStrongPassword(longOnes[i]!), longOnes[i]).toBe(false);
  });

  it('accepts a few unusual words', () => {
    for (const p of ['rowan-ellery-garage-1', 'brackenford-anvil-7', 'harrowgate-lantern-4']) expect(isStrongPassword(p), p).toBe(true);
  });

  it('gives the form the same message the server sends', () => {
    const result = SignUpSchema.safeParse({ name: 'Ori Fenwick', email: 'ori@example.test', password: 'password123' });
    expect(result.success).toBe(false);
    expect(result.error?.issues.map((i) => i.message)).toEqual([expect.stringMatching(/too common/)]);
  });
});
