import { expect } from 'vitest';
import { PartsmithError } from 'partsmith';

/** The PartsmithError a library call throws, as the fields of a problem document (to compare with the API's answer). */
export function thrown(call: () => unknown): Record<string, unknown> {
  try {
    call();
  } catch (error) {
    expect(error).toBeInstanceOf(PartsmithError);
    const e = error as PartsmithError;
    return e.errors.length > 0 ? { type: e.type, title: e.title, status: e.status, detail: e.detail, errors: e.errors } : { type: e.type, title: e.title, status: e.status, detail: e.detail };
  }
  throw new Error('expected a PartsmithError');
}
