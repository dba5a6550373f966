import { describe, expect, it } from 'vitest';
import type { EngineErrorCode } from '../src/index.ts';
import { EngineError, parseDeck } from '../src/index.ts';

// One case per error the deck reader raises. Each names the 1-based physical line and the
// offending token, so that an author can go straight to what to fix.

const ok = 'V1 a 0 1\nR1 a 0 1k\n';

interface ErrorCase {
  what: string;
  deck: string;
  code: EngineErrorCode;
  line: number;
  token?: string;
  message: string;
}

const cases: ErrorCase[] = [
  {
    what: 'a + line with no card before it',
    deck: 'title\n+ 1k\n',
    code: 'deck-syntax',
    line: 2,
    token: '+',
    message: "line 2: continuation line '+' has no card before it to continue",
  },
  {
    what: 'a parameter without a value',
    deck: `t\n${ok}M1 d g 0 0 n W=\n.model n nmos\n`,
    code: 'deck-syntax',
    line: 4,
    token: '=',
    message: 'line 4: parameter W has no value after',
  },
  {
    what: "an '=' without a name",
    deck: `t\n${ok}R2 = a 1k\n`,
    code: 'deck-syntax',
    line: 4,
    token: '=',
    message: "line 4: '=' without a parameter name before it",
  },
  {
    what: 'a bare token after parameters',
    deck: `t\n${ok}M1 d g 0 0 n W=1u 5\n.model n nmos\n`,
    code: 'deck-syntax',
    line: 4,
    token: '5',
    message: "line 4: unexpected '5' after the parameters",
  },
  {
    what: 'a garbage value',
    deck: `t\n${ok}R2 a b 4x7\n`,
    code: 'deck-syntax',
    line: 4,
    token: '4x7',
    message: "line 4: resistance of R2: '4x7' is not a value",
  },
  {
    what: 'a resistor without a value',
    deck: `t\n${ok}\n\nR2 a b\n`,
    code: 'deck-syntax',
    line: 6,
    token: 'b',
    message: 'line 6: R2 is incomplete; expected R2 n1 n2 resistance',
  },
  {
    what: 'an extra token on a resistor',
    deck: `t\n${ok}R2 a b 1k 2k\n`,
    code: 'deck-syntax',
    line: 4,
    token: '2k',
    message: "line 4: unexpected '2k' on R2",
  },
  {
    what: '.model without a type',
    deck: `t\n${ok}.model dx\n`,
    code: 'deck-syntax',
    line: 4,
    token: 'dx',
    message: 'line 4: .model needs a name and a type',
  },
  {
    what: 'a model name starting with a digit',
    deck: `t\n${ok}.model 1d d\n`,
    code: 'deck-syntax',
    line: 4,
    token: '1d',
    message: "line 4: model name '1d' must start with a letter",
  },
  {
    what: 'an unknown model type',
    deck: `t\n${ok}.model dx diode\n`,
    code: 'deck-syntax',
    line: 4,
    token: 'diode',
    message: "line 4: unknown model type 'diode'",
  },
  {
    what: 'a stray token in a .model card',
    deck: `t\n${ok}.model dx d 1e-14\n`,
    code: 'deck-syntax',
    line: 4,
    token: '1e-14',
    message: "line 4: unexpected '1e-14' in .model dx",
  },
  {
    what: 'a model LEVEL other than 1',
    deck: `t\n${ok}.model n nmos\n+ (level=3 vto=1)\n`,
    code: 'deck-syntax',
    line: 5,
    token: '3',
    message: 'line 5: model n: only LEVEL=1 is supported, not LEVEL=3',
  },
  {
    what: 'a malformed parameter name',
    deck: `t\n${ok}.model dx d (i-s=1)\n`,
    code: 'deck-syntax',
    line: 4,
    token: 'i-s',
    message: "line 4: 'i-s' is not a model parameter name",
  },
  {
    what: 'a model defined twice',
    deck: `t\n${ok}.model dx d\n.model DX d\n`,
    code: 'deck-syntax',
    line: 5,
    token: 'DX',
    message: 'line 5: model DX is defined twice (first on line 4)',
  },
  {
    what: 'a source with one node',
    deck: 'title\nV1 a\n',
    code: 'deck-syntax',
    line: 2,
    token: 'a',
    message: 'line 2: V1 needs two nodes',
  },
  {
    what: 'DC without a value',
    deck: 'title\nV1 a 0 DC\nR1 a 0 1\n',
    code: 'deck-syntax',
    line: 2,
    token: 'DC',
    message: 'line 2: V1: DC needs a value after it',
  },
  {
    what: 'an unclosed waveform',
    deck: 'title\nV1 a 0 1 PULSE(0 1\nR1 a 0 1\n',
    code: 'deck-syntax',
    line: 2,
    token: '(',
    message: "line 2: '(' is never closed",
  },
  {
    what: 'an unexpected source token',
    deck: 'title\nV1 a 0 1 2\nR1 a 0 1\n',
    code: 'deck-syntax',
    line: 2,
    token: '2',
    message: "line 2: unexpected '2' on V1",
  },
  {
    what: 'a multiplier M',
    deck: `t\n${ok}D1 a 0 dx M=2\n.model dx d\n`,
    code: 'deck-syntax',
    line: 4,
    token: '2',
    message: 'line 4: D1: the multiplier M is not supported',
  },
  {
    what: 'an undefined model',
    deck: `t\n${ok}D1 a 0 dz\n.model dx d\n`,
    code: 'unknown-model',
    line: 4,
    token: 'dz',
    message: "line 4: D1 uses model 'dz', which no .model card defines",
  },
  {
    what: 'a model of the wrong kind',
    deck: `t\n${ok}Q1 a a 0 dx\n.model dx d\n`,
    code: 'deck-syntax',
    line: 4,
    token: 'dx',
    message: 'line 4: Q1 needs a NPN or PNP model, but dx is D',
  },
  {
    what: 'a nonlinear controlled source',
    deck: `t\n${ok}E1 o 0 POLY(1) a 0 0 1\n`,
    code: 'deck-syntax',
    line: 4,
    token: 'POLY',
    message: 'line 4: E1: only the linear form E<name> out+ out- ctrl+ ctrl- gain is supported',
  },
  {
    what: 'a controlled source without gain',
    deck: `t\n${ok}G1 o 0 a 0\n`,
    code: 'deck-syntax',
    line: 4,
    token: '0',
    message: 'line 4: G1 is incomplete',
  },
  {
    what: '.temp without a value',
    deck: `t\n${ok}.temp\n`,
    code: 'deck-syntax',
    line: 4,
    token: '.temp',
    message: 'line 4: .temp needs a temperature in °C',
  },
  {
    what: '.temp below absolute zero',
    deck: `t\n${ok}.temp -300\n`,
    code: 'deck-syntax',
    line: 4,
    token: '-300',
    message: 'line 4: .temp -300 °C is below absolute zero',
  },
  {
    what: 'an incomplete .ac card',
    deck: `t\n${ok}.ac dec 10 1\n`,
    code: 'deck-syntax',
    line: 4,
    token: '1',
    message: 'line 4: .ac needs dec|oct|lin',
  },
  {
    what: 'an extra token on .ac',
    deck: `t\n${ok}.ac dec 10 1 1k 5\n`,
    code: 'deck-syntax',
    line: 4,
    token: '5',
    message: "line 4: unexpected '5' on .ac",
  },
  {
    what: 'an unknown sweep type',
    deck: `t\n${ok}.ac log 10 1 1k\n`,
    code: 'deck-syntax',
    line: 4,
    token: 'log',
    message: 'line 4: .ac type',
  },
  {
    what: 'a fractional point count',
    deck: `t\n${ok}.ac dec 2.5 1 1k\n`,
    code: 'deck-syntax',
    line: 4,
    token: '2.5',
    message: 'line 4: .ac points',
  },
  {
    what: 'a stop frequency below the start',
    deck: `t\n${ok}.ac lin 5 1k\n+ 10\n`,
    code: 'deck-syntax',
    line: 5,
    token: '10',
    message: 'line 5: .ac fstop: stop frequency is below start frequency',
  },
  {
    what: 'an element defined twice',
    deck: `t\n${ok}r1 a 0 2k\n`,
    code: 'deck-syntax',
    line: 4,
    token: 'r1',
    message: 'line 4: r1 is defined twice (first on line 3)',
  },
  {
    what: 'a zero resistance',
    deck: `t\n${ok}R2 a b 0\n`,
    code: 'invalid-circuit',
    line: 4,
    token: 'value',
    message: 'line 4: R2 value:',
  },
  {
    what: 'a node name with a forbidden character',
    deck: `t\n${ok}R2 a b#2 1k\n`,
    code: 'invalid-circuit',
    line: 4,
    token: 'nodes.1',
    message: 'line 4: R2 nodes.1: node name may hold letters, digits and _ . : + - only',
  },
];

describe('parseDeck errors', () => {
  it.each(cases)('$what → $code on line $line', ({ deck, code, line, token, message }) => {
    let caught: unknown;
    try {
      parseDeck(deck);
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(EngineError);
    const error = caught as EngineError;
    expect(error.code).toBe(code);
    expect(error.message).toContain(message);
    expect(error.details.line).toBe(line);
    if (token !== undefined) expect(error.details.token).toBe(token);
  });

  it('names the element in an invalid-circuit error', () => {
    expect(() => parseDeck(`t\n${ok}C7 a b -1n\n`)).toThrow(
      expect.objectContaining({
        details: expect.objectContaining({ element: 'c7', line: 4 }),
      }) as Error,
    );
  });

  it('gives the physical line of a garbage line after comments and continuations', () => {
    const deck =
      'title\n* a comment\nV1 a 0\n+ DC 5\n\n; only a comment\nR1 a 0 1k\n%%% garbage here\n';
    expect(() => parseDeck(deck)).not.toThrow();
    expect(parseDeck(deck).warnings).toEqual([
      {
        line: 8,
        message: 'element %%% (letter %) is not supported by the engine; ignored',
        text: '%%% garbage here',
      },
    ]);
    expect(() => parseDeck('title\nV1 a 0 DC 5\n+ AC 1 zz\nR1 a 0 1k\n')).toThrow(
      expect.objectContaining({ details: { line: 3, token: 'zz' } }) as Error,
    );
  });
});
