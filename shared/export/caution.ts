// The caution every export (except CSV, which stays pure data) and the dashboard show.
// DESIGN.md section 12; our own wording.
export const CAUTION =
  'Caution: these results are engineering estimates. Heat-transfer correlations are typically ' +
  'uncertain by 10–25 % and apply only inside their validity ranges; flagged points lie outside ' +
  'them. Where a design involves hot surfaces, pressure equipment or electrical enclosures, ' +
  'follow the applicable codes and have the design checked by a licensed engineer.';
