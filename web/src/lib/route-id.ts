// Ids in page addresses (/runs/:id, /runs/:id/points/:point): read strictly, so an address
// such as /runs/-1 or /runs/abc shows "not found" without asking the API for run -1 or NaN.

/** A database id: a positive integer written plainly (`12`), else undefined. */
export function routeId(text: string | undefined): number | undefined {
  return text !== undefined && /^[1-9]\d{0,14}$/.test(text) ? Number(text) : undefined;
}

/** A point index: a non-negative integer (`0`, `41`), else undefined. */
export function routeIndex(text: string | undefined): number | undefined {
  return text !== undefined && /^(0|[1-9]\d{0,14})$/.test(text) ? Number(text) : undefined;
}
