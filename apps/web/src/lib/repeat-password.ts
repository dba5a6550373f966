import type { z } from 'zod';

export const repeatPasswordMismatch = 'The two passwords differ; type the same password twice.';

/**
 * A zod refinement for forms that ask for a new password twice: the field `repeatPassword`
 * must equal the field named `passwordField`.
 */
export function samePasswordTwice(passwordField: string) {
  return (values: Record<string, unknown>, ctx: z.RefinementCtx) => {
    if (values[passwordField] !== values.repeatPassword) {
      ctx.addIssue({ code: 'custom', path: ['repeatPassword'], message: repeatPasswordMismatch });
    }
  };
}
