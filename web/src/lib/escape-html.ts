// The one escape for text that reaches an HTML sink: ECharts tooltips (rendered as HTML),
// and any other innerHTML-like place. Series names, method ids of pushed runs, string
// input values, measurement and study names are user-controlled: a measurement named
// `<img src=x onerror=…>` must show as that text, never run.
const entities: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

export function escapeHtml(text: unknown): string {
  return String(text).replace(/[&<>"']/g, (c) => entities[c]);
}
