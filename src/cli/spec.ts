import { flagOf } from './flags.js';

/** One query parameter of an endpoint, as the OpenAPI document describes it. */
export interface ParamSpec {
  readonly name: string;
  readonly required: boolean;
  readonly description: string;
  readonly type: string;
  readonly enum?: readonly string[];
  readonly default?: unknown;
  readonly minimum?: number;
  readonly maximum?: number;
}

export interface EndpointSpec {
  readonly path: string;
  readonly summary: string;
  readonly params: readonly ParamSpec[];
}

interface OpenApiParameter {
  name: string;
  required?: boolean;
  description?: string;
  schema?: { type?: string; enum?: string[]; default?: unknown; minimum?: number; maximum?: number };
}

/** The GET endpoints of an OpenAPI document, keyed by path. */
export function endpointSpecs(openapi: Record<string, unknown>): Map<string, EndpointSpec> {
  const out = new Map<string, EndpointSpec>();
  const paths = (openapi.paths ?? {}) as Record<string, { get?: { summary?: string; parameters?: OpenApiParameter[] } }>;
  for (const [path, item] of Object.entries(paths)) {
    if (!item.get) continue;
    const params = (item.get.parameters ?? []).map((p) => ({
      name: p.name,
      required: p.required === true,
      description: p.description ?? '',
      type: p.schema?.type ?? 'string',
      enum: p.schema?.enum,
      default: p.schema?.default,
      minimum: p.schema?.minimum,
      maximum: p.schema?.maximum,
    }));
    out.set(path, { path, summary: item.get.summary ?? '', params });
  }
  return out;
}

export function isSwitchParam(spec: EndpointSpec, name: string): boolean {
  return spec.params.some((p) => p.name === name && p.type === 'boolean');
}

/** Help lines for an endpoint's parameters, e.g. "  --max-part <integer>  Every part is at most this. (1 to 1000000000)". */
export function paramHelp(spec: EndpointSpec): string[] {
  const rows = spec.params.map((p) => {
    const value = p.type === 'boolean' ? '' : p.enum ? ` ${p.enum.join('|')}` : p.type === 'array' ? ' <list>' : ` <${p.type}>`;
    const notes: string[] = [];
    if (p.required) notes.push('required');
    if (p.minimum !== undefined && p.maximum !== undefined) notes.push(`${p.minimum} to ${p.maximum}`);
    if (p.default !== undefined) notes.push(`default ${String(p.default)}`);
    return [`${flagOf(p.name)}${value}`, `${p.description}${notes.length ? ` (${notes.join('; ')})` : ''}`];
  });
  const width = Math.max(0, ...rows.map((r) => r[0].length)) + 2;
  return rows.map(([left, right]) => `  ${left.padEnd(width)}${right}`);
}
