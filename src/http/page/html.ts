/**
 * A minimal HTML template: `html\`<p>${text}</p>\`` escapes every interpolated value unless it is
 * itself Html (a nested template or trusted markup such as a drawing made by the core).
 * Arrays are joined; null, undefined and false render nothing.
 */
export class Html {
  constructor(readonly value: string) {}
  toString(): string {
    return this.value;
  }
}

export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (ch) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[ch]!);
}

function render(value: unknown): string {
  if (value === null || value === undefined || value === false) return '';
  if (value instanceof Html) return value.value;
  if (Array.isArray(value)) return value.map(render).join('');
  return escapeHtml(String(value));
}

export function html(strings: TemplateStringsArray, ...values: unknown[]): Html {
  let out = strings[0];
  for (let i = 0; i < values.length; i++) out += render(values[i]) + strings[i + 1];
  return new Html(out);
}

/** Markup produced by trusted code (the core's SVG drawings, which escape their own text). */
export function trusted(markup: string): Html {
  return new Html(markup);
}
