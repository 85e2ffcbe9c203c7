/** Telling a decimal comma (`12,5`) from a decimal point (`12.5`) in the data rows. */
import { decimalSeparatorOf } from '../numbers';
import { isBlank, isComment, splitLine, type Delimiter, type SampleLine } from './lines';

/** How many data rows are sampled. */
const SAMPLED_ROWS = 50;

/**
 * Decimal comma only with `;` or tab, when data cells like `12,5` are at least as common as `12.5`
 * in the first {@link SAMPLED_ROWS} data rows; `mixed` when both appear.
 */
export function detectDecimalSeparator(lines: readonly SampleLine[], delimiter: Delimiter, firstDataLine: number): { decimalComma: boolean; mixed: boolean } {
  let commas = 0;
  let points = 0;
  if (delimiter !== ',') {
    let seen = 0;
    for (const l of lines) {
      if (l.line < firstDataLine || isBlank(l.text) || isComment(l.text)) continue;
      if (++seen > SAMPLED_ROWS) break;
      for (const c of splitLine(l.text, delimiter)) {
        const separator = decimalSeparatorOf(c);
        if (separator === 'comma') commas++;
        else if (separator === 'point') points++;
      }
    }
  }
  return { decimalComma: commas > 0 && commas >= points, mixed: commas > 0 && points > 0 };
}
