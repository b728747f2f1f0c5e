// The payment service's API takes application/x-www-form-urlencoded bodies with bracketed keys
// (line_items[0][price_data][currency]=eur). This turns them into nested objects and arrays.

type Node = Record<string, unknown>;

export function parseForm(body: string): Node {
  const root: Node = {};
  for (const [rawKey, value] of new URLSearchParams(body)) {
    const parts = rawKey.replace(/\]/g, "").split("[");
    let node: Node = root;
    parts.forEach((part, i) => {
      if (i === parts.length - 1) {
        node[part] = value;
        return;
      }
      node[part] ??= {};
      node = node[part] as Node;
    });
  }
  return arrays(root) as Node;
}

/** Objects whose keys are 0, 1, 2… become arrays. */
function arrays(value: unknown): unknown {
  if (!value || typeof value !== "object") return value;
  const obj = value as Node;
  for (const k of Object.keys(obj)) obj[k] = arrays(obj[k]);
  const keys = Object.keys(obj);
  if (keys.length && keys.every((k, i) => k === String(i))) return keys.map((k) => obj[k]);
  return obj;
}
