import { describe, expect, it } from 'vitest';
import {
  createProjectRequestSchema,
  solveRequestSchema,
  sweepPointCount,
  updateWorksheetRequestSchema,
  worksheetListQuerySchema,
} from '../index.ts';

const fieldMessages = (r: { error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
  Object.fromEntries((r.error?.issues ?? []).map((i) => [i.path.join('.'), i.message]));

describe('project and worksheet schemas', () => {
  it('a project code is trimmed, checked and stored upper case', () => {
    expect(createProjectRequestSchema.parse({ name: ' Tidewater ', code: ' twh-2 ' })).toEqual({
      name: 'Tidewater',
      code: 'TWH-2',
      description: '',
    });
    expect(fieldMessages(createProjectRequestSchema.safeParse({ name: '', code: 'a b' }))).toEqual({
      name: 'Enter a project name.',
      code: 'Use letters, digits, - _ and . only, starting with a letter or digit.',
    });
  });

  it('the worksheet list query reads filters, several states and defaults from query strings', () => {
    expect(
      worksheetListQuerySchema.parse({
        state: 'draft,returned',
        assignedToMe: 'true',
        limit: '10',
      }),
    ).toEqual({
      state: ['draft', 'returned'],
      assignedToMe: true,
      sort: 'updatedAt',
      limit: 10,
      offset: 0,
    });
    expect(
      fieldMessages(
        worksheetListQuerySchema.safeParse({ state: 'draft,lost', limit: '500', sort: 'size' }),
      ),
    ).toEqual({
      state:
        'Unknown state lost; use states among draft, in_check, checked, signed_off, returned, withdrawn, superseded.',
      limit: 'Use 1 to 100.',
      sort: 'Sort by title, updatedAt or state.',
    });
  });

  it('a worksheet update needs the version and something to change', () => {
    expect(fieldMessages(updateWorksheetRequestSchema.safeParse({ title: 'x' }))).toEqual({
      version: 'Send the version you last read.',
    });
    expect(fieldMessages(updateWorksheetRequestSchema.safeParse({ version: 3 }))).toEqual({
      '': 'Nothing to change.',
    });
  });

  it.each([
    [{ type: 'dec', points: 20, fstart: 1, fstop: 100e6 }, 161],
    [{ type: 'oct', points: 1, fstart: 1, fstop: 8 }, 4],
    [{ type: 'lin', points: 50, fstart: 1, fstop: 2 }, 50],
  ] as const)('the sweep %j visits %i frequencies', (sweep, count) => {
    expect(sweepPointCount(sweep)).toBe(count);
  });

  it('an unsaved draft is refused beyond 500 elements or 2001 sweep points, with the field named', () => {
    const resistor = (i: number) => ({ kind: 'R', name: `R${i}`, nodes: ['a', '0'], value: 1 });
    const big = solveRequestSchema.safeParse({
      circuit: { elements: Array.from({ length: 501 }, (_, i) => resistor(i)) },
      settings: { sweep: { type: 'dec', points: 1000, fstart: 1, fstop: 1e9 } },
    });
    expect(fieldMessages(big)).toEqual({
      'circuit.elements': 'A circuit has at most 500 elements.',
      'settings.sweep': expect.stringContaining('more than 2001 frequencies'),
    });
    const small = solveRequestSchema.parse({ circuit: { elements: [resistor(1)] } });
    expect(small.settings.temperature).toBe(27);
  });
});
