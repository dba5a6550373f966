import { describe, expect, it } from 'vitest';
import { sanitizeFilename, sniffAttachmentType } from '../sniff.ts';
import { contentDisposition } from '../routes.ts';
import { samples } from './samples.ts';

const text = (s: string) => Buffer.from(s, 'utf8');

describe('sniffing an attachment from its content', () => {
  it.each([
    ['a PDF (%PDF- header)', samples.pdf(), 'pdf', 'application/pdf'],
    ['a PNG (8-byte signature)', samples.png(), 'png', 'image/png'],
    ['a JPEG (FF D8 FF)', samples.jpeg(), 'jpeg', 'image/jpeg'],
    [
      'a deck the engine parses (no directive)',
      text('divider\nV1 in 0 5\nR1 in out 1k\nR2 out 0 1k\n'),
      'deck',
      'text/plain; charset=utf-8',
    ],
    [
      'a deck with an .op card',
      text('bias\n* comment only\n.op\n'),
      'deck',
      'text/plain; charset=utf-8',
    ],
    [
      'a deck with .end',
      text('title\nnot a card here\n  .END\n'),
      'deck',
      'text/plain; charset=utf-8',
    ],
    ['a comma CSV', text('f_Hz,gain_dB\n10,20.1\n100,20.0\n'), 'csv', 'text/csv; charset=utf-8'],
    [
      'a semicolon CSV with CRLF and a BOM',
      text('\uFEFFVin;Vout\r\n1,0;0,5\r\n2,0;1,0\r\n'),
      'csv',
      'text/csv; charset=utf-8',
    ],
    ['a tab CSV', text('a\tb\tc\n1\t2\t3\n'), 'csv', 'text/csv; charset=utf-8'],
    [
      'a CSV with a quoted delimiter and newline',
      text('name,note\nQ1,"hot, ""very""\nsee log"\nQ2,ok\n'),
      'csv',
      'text/csv; charset=utf-8',
    ],
  ])('when the bytes are %s, then the type is %s', (_what, bytes, type, contentType) => {
    expect(sniffAttachmentType(bytes)).toEqual({ type, contentType });
  });

  it.each([
    ['an SVG', text('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>')],
    ['an SVG after an XML declaration and spaces', text('  \n<?xml version="1.0"?>\n<svg/>')],
    ['an HTML page', text('<!doctype html><title>x</title>,a,b\n1,2,3\n')],
    ['a GIF', Buffer.from('GIF89a\x01\x00\x01\x00', 'latin1')],
    ['a ZIP', Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0x00, 0x00])],
    ['invalid UTF-8', Buffer.from([0x61, 0x2c, 0x62, 0x0a, 0xc3, 0x28, 0x2c, 0x31, 0x0a])],
    ['text with a NUL byte', text('a,b\n1,\u00002\n')],
    ['prose without a delimiter structure', text('Hello there.\nNo table here\n')],
    ['rows of different widths', text('a,b,c\n1,2\n')],
    ['a single column', text('value\n1\n2\n')],
    ['an unterminated quote', text('a,b\n"1,2\n')],
    ['only whitespace', text('  \n\t\n')],
    ['a PDF header not at the start', text(' %PDF-1.7\n')],
  ])('when the bytes are %s, then it is refused', (_what, bytes) => {
    expect(sniffAttachmentType(bytes)).toBeNull();
  });

  it('when a PDF carries a PNG name, then only its content counts: it is a PDF', () => {
    // The sniffer never sees the name; the API test checks the renamed upload end to end.
    expect(sniffAttachmentType(samples.pdf())?.type).toBe('pdf');
  });
});

describe('file names', () => {
  it.each([
    ['../../etc/passwd', 'passwd'],
    ['C:\\Users\\ann\\scope shot.png', 'scope shot.png'],
    ['bias\u0000\u0007point\r\n.csv', 'biaspoint.csv'],
    ['invoice\u202Egnp.exe', 'invoicegnp.exe'],
    ['...hidden.csv', 'hidden.csv'],
    ['   ', 'fallback.pdf'],
    ['/', 'fallback.pdf'],
    ['Messung Ω – Stufe 2.csv', 'Messung Ω – Stufe 2.csv'],
  ])('when the uploaded name is %j, then the stored name is %j', (raw, stored) => {
    expect(sanitizeFilename(raw, 'fallback.pdf')).toBe(stored);
  });

  it('when a name is longer than 200 characters, then it is cut to 200 and keeps its extension', () => {
    const name = sanitizeFilename(`${'ω'.repeat(300)}.pdf`);
    expect([...name]).toHaveLength(200);
    expect(name.endsWith('ω.pdf')).toBe(true);
  });

  it('when a name has quotes, non-ASCII and header syntax, then Content-Disposition carries it safely in both forms', () => {
    const header = contentDisposition('Gain "Ω"; a=b\\(1)\'*.csv');
    expect(header).toBe(
      'attachment; filename="Gain ___; a=b_(1)\'*.csv"; ' +
        "filename*=UTF-8''Gain%20%22%CE%A9%22%3B%20a%3Db%5C%281%29%27%2A.csv",
    );
    expect(decodeURIComponent(header.split("UTF-8''")[1]!)).toBe('Gain "Ω"; a=b\\(1)\'*.csv');
  });
});
