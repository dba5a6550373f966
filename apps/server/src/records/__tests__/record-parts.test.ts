import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { csvField, toCsv } from '../csv/csv.ts';
import { fmt, fmtTime } from '../format.ts';
import { manifest, safeEntryName, zipPackage } from '../package/record-package.ts';
import { textRuns } from '../report/fonts.ts';
import { renderReport } from '../report/render-report.ts';
import { sampleRecord } from '../sample-record.ts';
import { pdfText, verifyPackage } from './record-steps.ts';

describe('CSV fields (RFC 4180, spreadsheet formula injection)', () => {
  it.each([
    ['plain', 'plain'],
    ['with, comma', '"with, comma"'],
    ['say "hi"', '"say ""hi"""'],
    ['two\nlines', '"two\nlines"'],
    ['=1+2', "'=1+2"],
    ['+1', "'+1"],
    ['-cmd', "'-cmd"],
    ['@SUM(A1)', "'@SUM(A1)"],
    ['\tTAB', "'\tTAB"],
    ['=HYPERLINK("x")', `"'=HYPERLINK(""x"")"`],
    ['a=b', 'a=b'],
  ])('when the text is %j, then the field is %j', (text, field) => {
    expect(csvField(text)).toBe(field);
  });

  it.each([
    [-0.0015, '-0.0015'],
    [1e-15, '1e-15'],
    [Number.POSITIVE_INFINITY, 'Infinity'],
    [Number.NEGATIVE_INFINITY, '-Infinity'],
    [Number.NaN, 'NaN'],
    [null, ''],
  ])(
    'when the number is %s, then it is written as %j (numbers are never neutralized)',
    (value, field) => {
      expect(csvField(value)).toBe(field);
    },
  );

  it('when a table is written, then it starts with a byte order mark and every line ends in CRLF', () => {
    expect(toCsv(['a', 'b (Ω)'], [[1, 'x']])).toBe('\uFEFFa,b (Ω)\r\n1,x\r\n');
  });
});

describe('times and numbers in a record', () => {
  // Offsets from the IANA time zone database (from memory): Berlin CET +1 / CEST +2,
  // New York EST −5, Kolkata IST +5:30 all year.
  it.each([
    ['2026-07-01T12:00:00Z', 'Europe/Berlin', '2026-07-01 14:00:00 +02:00'],
    ['2026-12-01T23:30:05Z', 'Europe/Berlin', '2026-12-02 00:30:05 +01:00'],
    ['2026-01-15T03:04:05.999Z', 'America/New_York', '2026-01-14 22:04:05 -05:00'],
    ['2026-03-01T00:00:00Z', 'Asia/Kolkata', '2026-03-01 05:30:00 +05:30'],
    ['2026-03-01T00:00:00Z', 'UTC', '2026-03-01 00:00:00 +00:00'],
    ['2026-03-01T00:00:00Z', 'Not/AZone', '2026-03-01 00:00:00 +00:00'],
  ])('when %s is shown in %s, then it reads %s', (at, zone, text) => {
    expect(fmtTime(at, zone)).toBe(text);
  });

  it.each([
    [9.36e-4, 'A', '936 µA'],
    [4700, 'Ω', '4.7 kΩ'],
    [Number.POSITIVE_INFINITY, 'Ω', 'infinite'],
    [0.005969, 'V/V', '0.005969 V/V'],
    [null, 'V', '—'],
  ])('when %s %s is formatted, then it reads %s', (value, unit, text) => {
    expect(fmt(value, unit)).toBe(text);
  });

  it('when text mixes scripts, then it is cut into runs of the Noto Sans subset that draws each', () => {
    expect(textRuns('rπ = 2.9 kΩ ± 5 %', 'regular')).toEqual([
      { font: 'noto-regular-latin', text: 'r' },
      { font: 'noto-regular-greek', text: 'π' },
      { font: 'noto-regular-latin', text: ' = 2.9 k' },
      { font: 'noto-regular-greek', text: 'Ω' },
      { font: 'noto-regular-latin', text: ' ± 5 %' },
    ]);
    expect(textRuns('ro ≈ ∞', 'bold')).toEqual([{ font: 'noto-bold-latin', text: 'ro ~ inf' }]);
  });
});

describe('the package container', () => {
  const files = [
    { path: 'a.txt', content: Buffer.from('alpha\n') },
    { path: 'attachments/b c.csv', content: Buffer.from('1,2\n') },
  ];

  it('when the manifest is written, then each line is "<sha256>  <path>" as sha256sum prints it', () => {
    const hex = (text: string) => createHash('sha256').update(text).digest('hex');
    expect(manifest(files).toString()).toBe(
      `${hex('alpha\n')}  a.txt\n${hex('1,2\n')}  attachments/b c.csv\n`,
    );
  });

  it('when the same files are zipped on servers in different time zones, then the zips are byte for byte equal and verify', async () => {
    const moment = new Date('2026-11-20T19:00:00Z');
    const zone = process.env.TZ;
    const zipIn = async (tz: string) => {
      process.env.TZ = tz; // Node applies a changed TZ to Date at once.
      return zipPackage(files, moment);
    };
    try {
      const first = await zipIn('America/New_York');
      const second = await zipIn('Asia/Tokyo');

      expect(second.equals(first)).toBe(true);
      expect(verifyPackage(first).ok).toBe(true);
    } finally {
      if (zone === undefined) delete process.env.TZ;
      else process.env.TZ = zone;
    }
  });

  it.each([
    ['../../etc/passwd', '_.._etc_passwd'],
    ['scope\ncapture.png', 'scope_capture.png'],
    ['C:\\temp\\x.pdf', 'C__temp_x.pdf'],
    ['.hidden', 'hidden'],
    ['', 'attachment'],
  ])('when an attachment is named %j, then its entry is %j', (name, entry) => {
    expect(safeEntryName(name)).toBe(entry);
  });
});

describe('the report renderer on an invented record', () => {
  it('when the report is rendered without compression, then the Bode and load-line curves are moveto/lineto paths inside the plot boxes', async () => {
    const pdf = await renderReport(sampleRecord(), {
      generation: { at: new Date('2026-12-01T10:00:00Z'), by: 'Test', appVersion: '0.0.0' },
      compress: false,
    });

    const content = pdf.toString('latin1');
    // A plot: its box set as the clipping path (`x y w h re W n`), then a polyline of 60 or
    // more lineto operators (a curve can leave its box; the clip keeps the ink inside).
    const plots = [
      ...content.matchAll(
        /([-\d.]+) ([-\d.]+) ([-\d.]+) ([-\d.]+) re\nW n\n(?:[^\n]*\n){0,4}?((?:[-\d.]+ [-\d.]+ m\n)(?:[-\d.]+ [-\d.]+ l\n){60,})/g,
      ),
    ];
    // The device curves of the two load lines (Q1, D1: 101 points each) and the Bode magnitude
    // (81 frequencies); the phase breaks where its reading wraps at ±180°.
    expect(plots.map((p) => p[5]!.split('\n').length - 1)).toEqual([101, 101, 81]);
    for (const [, x, , width, , line] of plots) {
      const xs = [...line!.matchAll(/([-\d.]+) [-\d.]+ [ml]\n/g)].map((m) => Number(m[1]));
      expect(Math.min(...xs)).toBeCloseTo(Number(x), 1);
      expect(Math.max(...xs)).toBeCloseTo(Number(x) + Number(width), 1);
    }
    expect(pdfText(pdf)).toContain(
      'Generated 2026-12-01 11:00:00 +01:00 for Test by Biasproof 0.0.0',
    );
  });
});
