/**
 * A response shape: the JSON Schema that zod writes for a shared schema (`z.toJSONSchema`, see
 * scripts/response-shapes.ts), typed with the schema's output type. The first page's fetchers check their
 * bodies with these so that the page needs no zod; every other fetcher passes the zod schema itself.
 */
export interface Shape<T> {
  readonly schema: JsonShape;
  /** Type only: the parsed value's type. */
  readonly __type?: T;
}

/** The part of JSON Schema that z.toJSONSchema writes for the shapes we generate (the generator refuses anything else). */
type JsonType = 'object' | 'array' | 'string' | 'number' | 'integer' | 'boolean' | 'null';

export interface JsonShape {
  /** One type, or a list of them (z.toJSONSchema writes `["string", "null"]` for a nullable string). */
  type?: JsonType | JsonType[];
  properties?: Record<string, JsonShape>;
  required?: string[];
  additionalProperties?: JsonShape | false;
  propertyNames?: JsonShape;
  items?: JsonShape;
  enum?: readonly unknown[];
  const?: unknown;
  anyOf?: JsonShape[];
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  exclusiveMaximum?: number;
  minLength?: number;
  maxLength?: number;
  minItems?: number;
  maxItems?: number;
  pattern?: string;
}

const FAIL = Symbol('fail');
type Result = unknown | typeof FAIL;

function isObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function checkType(shape: JsonShape, value: unknown): boolean {
  if (Array.isArray(shape.type)) return shape.type.some((type) => checkType({ type }, value));
  switch (shape.type) {
    case undefined:
      return true;
    case 'object':
      return isObject(value);
    case 'array':
      return Array.isArray(value);
    case 'integer':
      return Number.isInteger(value);
    case 'number':
      return typeof value === 'number' && Number.isFinite(value);
    case 'null':
      return value === null;
    default:
      return typeof value === shape.type;
  }
}

function checkBounds(shape: JsonShape, value: unknown): boolean {
  if (typeof value === 'number') {
    if (shape.minimum !== undefined && value < shape.minimum) return false;
    if (shape.maximum !== undefined && value > shape.maximum) return false;
    if (shape.exclusiveMinimum !== undefined && value <= shape.exclusiveMinimum) return false;
    if (shape.exclusiveMaximum !== undefined && value >= shape.exclusiveMaximum) return false;
  }
  if (typeof value === 'string') {
    // zod counts a string's length in UTF-16 code units, as String.length does.
    if (shape.minLength !== undefined && value.length < shape.minLength) return false;
    if (shape.maxLength !== undefined && value.length > shape.maxLength) return false;
    if (shape.pattern !== undefined && !new RegExp(shape.pattern).test(value)) return false;
  }
  if (Array.isArray(value)) {
    if (shape.minItems !== undefined && value.length < shape.minItems) return false;
    if (shape.maxItems !== undefined && value.length > shape.maxItems) return false;
  }
  return true;
}

/** The value as zod's parse gives it (unknown keys of a non-strict object dropped), or FAIL. */
function read(shape: JsonShape, value: unknown): Result {
  if (shape.anyOf) {
    // zod's union answers with its first option that parses.
    for (const option of shape.anyOf) {
      const result = read(option, value);
      if (result !== FAIL) return result;
    }
    return FAIL;
  }
  if ('const' in shape && value !== shape.const) return FAIL;
  if (shape.enum && !shape.enum.includes(value)) return FAIL;
  if (!checkType(shape, value) || !checkBounds(shape, value)) return FAIL;
  if (Array.isArray(value) && shape.items) {
    const items = shape.items;
    const out: unknown[] = [];
    for (const item of value) {
      const result = read(items, item);
      if (result === FAIL) return FAIL;
      out.push(result);
    }
    return out;
  }
  if (isObject(value) && (shape.properties || shape.additionalProperties !== undefined)) {
    const out: Record<string, unknown> = {};
    const properties = shape.properties ?? {};
    for (const key of shape.required ?? []) if (!(key in value)) return FAIL;
    for (const [key, property] of Object.entries(properties)) {
      if (!(key in value)) continue;
      const result = read(property, value[key]);
      if (result === FAIL) return FAIL;
      out[key] = result;
    }
    for (const key of Object.keys(value)) {
      if (shape.propertyNames && read(shape.propertyNames, key) === FAIL) return FAIL;
      if (key in properties) continue;
      if (shape.additionalProperties === false) return FAIL;
      if (shape.additionalProperties) {
        const result = read(shape.additionalProperties, value[key]);
        if (result === FAIL) return FAIL;
        out[key] = result;
      }
    }
    return out;
  }
  return value;
}

/** Checks a parsed JSON body against a shape: `{ success: true, data }` with zod's output, or `{ success: false }`. */
export function checkShape<T>(shape: Shape<T>, value: unknown): { success: true; data: T } | { success: false } {
  const result = read(shape.schema, value);
  return result === FAIL ? { success: false } : { success: true, data: result as T };
}
