// JSON that packsmith wrote, read back: the value, or in words why it cannot be read.
export function parseJson(text: string): { ok: true; value: unknown } | { ok: false; why: string } {
  try {
    return { ok: true, value: JSON.parse(text) };
  } catch (e) {
    return { ok: false, why: `not JSON (${(e as Error).message})` };
  }
}
