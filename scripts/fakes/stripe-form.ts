// Decodes the application/x-www-form-urlencoded bodies the `stripe` SDK sends (stringifyRequestData in
// node_modules/stripe/esm/utils.js): nested objects as `a[b][c]=v`, arrays as `a[0]=v`, everything a string.
export type FormValue = string | FormValue[] | FormObject;
export interface FormObject {
  [key: string]: FormValue;
}

export class FormDecodeError extends Error {
  constructor(
    message: string,
    readonly param: string,
  ) {
    super(message);
    this.name = "FormDecodeError";
  }
}

// Keys that would reach Object.prototype through plain-object assignment.
const FORBIDDEN_SEGMENTS = new Set(["__proto__", "prototype", "constructor"]);

function splitKey(key: string): string[] {
  const open = key.indexOf("[");
  if (open === -1) return [key];
  const segments = [key.slice(0, open)];
  const rest = key.slice(open);
  const pattern = /\[([^\]]*)\]/gy;
  let consumed = 0;
  for (let match = pattern.exec(rest); match !== null; match = pattern.exec(rest)) {
    segments.push(match[1] ?? "");
    consumed = pattern.lastIndex;
  }
  if (consumed !== rest.length) throw new FormDecodeError(`Invalid parameter name: ${key}`, key);
  return segments;
}

function isIndex(segment: string): boolean {
  return segment === "" || /^\d+$/.test(segment);
}

export function decodeForm(body: string): FormObject {
  const root: FormObject = {};
  for (const [key, value] of new URLSearchParams(body)) {
    const segments = splitKey(key);
    if (segments.some((segment) => FORBIDDEN_SEGMENTS.has(segment)) || segments[0] === "") {
      throw new FormDecodeError(`Invalid parameter name: ${key}`, key);
    }
    let container: FormObject | FormValue[] = root;
    for (let i = 0; i < segments.length; i += 1) {
      const segment = segments[i] ?? "";
      const last = i === segments.length - 1;
      const nextIsIndex = !last && isIndex(segments[i + 1] ?? "");
      if (Array.isArray(container)) {
        if (!isIndex(segment)) throw new FormDecodeError(`Invalid parameter name: ${key}`, key);
        const index: number = segment === "" ? container.length : Number(segment);
        if (last) {
          container[index] = value;
        } else {
          const existing: FormValue | undefined = container[index];
          const child: FormObject | FormValue[] =
            existing !== undefined && typeof existing !== "string" ? existing : nextIsIndex ? [] : {};
          container[index] = child;
          container = child;
        }
      } else {
        if (last) {
          container[segment] = value;
        } else {
          const existing: FormValue | undefined = container[segment];
          const child: FormObject | FormValue[] =
            existing !== undefined && typeof existing !== "string" ? existing : nextIsIndex ? [] : {};
          container[segment] = child;
          container = child;
        }
      }
    }
  }
  return root;
}

/** A stable text for a decoded body, so that key order never makes two equal requests look different. */
export function canonicalForm(value: FormValue): string {
  if (typeof value === "string") return JSON.stringify(value);
  if (Array.isArray(value)) return `[${value.map((item) => canonicalForm(item ?? "")).join(",")}]`;
  const keys = Object.keys(value).sort();
  return `{${keys.map((key) => `${JSON.stringify(key)}:${canonicalForm(value[key] ?? "")}`).join(",")}}`;
}
