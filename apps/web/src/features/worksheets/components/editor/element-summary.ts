import { formatValue, type Element } from '@biasproof/calc';

/** One line that says what an element is worth, for the element table. */
export function elementSummary(el: Element): string {
  switch (el.kind) {
    case 'R':
      return formatValue(el.value, 'Ω');
    case 'C':
      return formatValue(el.value, 'F');
    case 'L':
      return formatValue(el.value, 'H');
    case 'V':
    case 'I': {
      const unit = el.kind === 'V' ? 'V' : 'A';
      const ac = el.ac
        ? `, AC ${formatValue(el.ac.mag, unit)} ∠ ${formatValue(el.ac.phase, '°')}`
        : '';
      return `${formatValue(el.dc, unit)} DC${ac}`;
    }
    case 'D':
    case 'Q':
      return el.area === 1 ? el.model : `${el.model} × ${el.area}`;
    case 'M':
      return `${el.model}, W ${formatValue(el.w, 'm')}, L ${formatValue(el.l, 'm')}`;
    case 'E':
      return `${formatValue(el.gain, '')} V/V`;
    case 'G':
      return formatValue(el.gain, 'S');
  }
}
