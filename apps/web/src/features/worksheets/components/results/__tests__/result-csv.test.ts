import { describe, expect, it } from 'vitest';
import { toCsv } from '@/features/worksheets/components/results/result-csv.ts';
import {
  formatPercentDifference,
  formatResult,
} from '@/features/worksheets/components/results/result-format.ts';

describe('result tables as CSV', () => {
  it('when a column shares one unit, then the unit goes to the heading and the cells hold full-precision SI numbers', () => {
    const csv = toCsv(
      ['Quantity', 'Value', 'Note'],
      [
        {
          key: 'a',
          cells: [
            { text: 'V(out)' },
            { value: 0.692887832378056, unit: 'V', path: 'nodes.out' },
            { text: 'has, a comma' },
          ],
        },
        {
          key: 'b',
          cells: [
            { text: 'V(in)' },
            { value: 5, unit: 'V', path: 'nodes.in' },
            { chip: 'forward', tone: 'ok' },
          ],
        },
      ],
    );
    expect(csv).toBe(
      'Quantity,Value (V),Note\r\nV(out),0.692887832378056,"has, a comma"\r\nV(in),5,forward\r\n',
    );
  });

  it('when a column mixes units or has no value, then each cell carries its unit and gaps stay empty', () => {
    const csv = toCsv(
      ['Quantity', 'Magnitude'],
      [
        { key: 'g', cells: [{ text: 'Gain' }, { value: 0.25, unit: 'V/V', path: 'gain.vv' }] },
        {
          key: 'z',
          cells: [{ text: 'Zin "total"' }, { value: Infinity, unit: 'Ω', path: 'zin.ohm' }],
        },
        {
          key: 'c',
          cells: [{ text: 'Corner' }, { value: null, unit: 'Hz', path: 'sweep.lowCornerHz' }],
        },
      ],
    );
    expect(csv).toBe(
      'Quantity,Magnitude\r\nGain,0.25 V/V\r\n"Zin ""total""",Infinity Ω\r\nCorner,\r\n',
    );
  });

  it('when results are shown, then ratios read as plain numbers and differences carry their sign', () => {
    expect(formatResult(0.005969319761601975, 'V/V')).toBe('0.005969 V/V');
    expect(formatResult(123.456, '')).toBe('123.5');
    expect(formatResult(2.5e-7, '')).toBe('2.5e-7');
    expect(formatResult(4.307e-3, 'A')).toBe('4.307 mA');
    expect(formatResult(null, 'Hz')).toBe('—');
    expect(formatPercentDifference(-16.0870626)).toBe('−16.1 %');
    expect(formatPercentDifference(0.15354)).toBe('+0.154 %');
    expect(formatPercentDifference(0)).toBe('0 %');
  });
});
