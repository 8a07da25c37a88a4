import { diagnosisInputSchema, type DiagnosisInput } from '../../../../shared/schemas/diagnosis';
import { editableQuantity, readQuantity } from '../../../lib/quantity';
import { BLANK_VALUES, DEFAULT_VALUES, FIELDS, FIELD_BY_KEY, type DiagnoseValues, type FieldKey } from './diagnose-fields';
import { PRESETS } from './presets';

export interface FormReading {
  /** The body for `POST /api/diagnosis`, with every field that could not be read left out. */
  input: DiagnosisInput;
  /** A message per field that cannot be read or is out of bounds. */
  errors: Partial<Record<FieldKey, string>>;
}

type Nested = Record<string, Record<string, number | string | boolean>>;

function put(target: Nested, key: string, value: number | string | boolean) {
  const [group, field] = key.split('.');
  (target[group] ??= {})[field] = value;
}

/**
 * Reads the form the way the server will: engineering notation first (readQuantity), then
 * the shared zod schema for bounds, so a value the API would refuse is flagged here too.
 */
export function readForm(values: DiagnoseValues): FormReading {
  const errors: Partial<Record<FieldKey, string>> = {};
  const raw: Nested = {};
  for (const f of FIELDS) {
    const text = values[f.key];
    if (f.kind === 'choice') {
      if (text !== '') put(raw, f.key, f.reads === 'number' ? Number(text) : f.reads === 'boolean' ? text === 'true' : text);
      continue;
    }
    const reading = readQuantity(text, f.unit);
    if (reading.kind === 'ok') put(raw, f.key, reading.value);
    else if (reading.kind === 'error') errors[f.key] = reading.message;
  }
  const checked = diagnosisInputSchema.safeParse(raw);
  if (checked.success) return { input: checked.data, errors };
  for (const issue of checked.error.issues) {
    const key = issue.path.join('.') as FieldKey;
    if (!(key in FIELD_BY_KEY)) continue;
    errors[key] ??= issue.message;
    const [group, field] = key.split('.');
    delete raw[group]?.[field];
  }
  const retry = diagnosisInputSchema.safeParse(raw);
  return { input: retry.success ? retry.data : {}, errors };
}

/** True when anything under "What the scope showed" was given. */
export function hasObservation(input: DiagnosisInput): boolean {
  return Object.values(input.observed ?? {}).some((v) => v !== null && v !== undefined);
}

/**
 * The form a link asks for: `?preset=<id>`, and/or fields by their API path in SI units or
 * engineering notation (`signal.expectedAmplitudeV=3.3`, `probe.tipCapacitanceF=12p`). A link
 * that names fields starts from a blank form, so it means only what it says.
 */
export function valuesFromQuery(params: URLSearchParams): { values: DiagnoseValues; touched: FieldKey[] } {
  const preset = PRESETS.find((p) => p.id === params.get('preset'));
  const named = FIELDS.filter((f) => params.has(f.key));
  if (!preset && named.length === 0) return { values: DEFAULT_VALUES, touched: [] };
  const values: DiagnoseValues = { ...BLANK_VALUES, ...(preset?.values ?? {}) };
  const touched: FieldKey[] = [];
  for (const f of named) {
    const text = (params.get(f.key) ?? '').trim();
    touched.push(f.key);
    if (f.kind === 'choice') {
      values[f.key] = f.reads === 'number' && Number.isFinite(Number(text)) ? String(Number(text)) : text;
      continue;
    }
    const reading = readQuantity(text, f.unit);
    values[f.key] = reading.kind === 'ok' ? editableQuantity(reading.value, f.unit) : text;
  }
  return { values, touched };
}

/** The query string for a setup, so the address bar can be shared: SI numbers under API paths. */
export function queryFromInput(input: DiagnosisInput): URLSearchParams {
  const params = new URLSearchParams();
  for (const [group, fields] of Object.entries(input)) {
    for (const [field, value] of Object.entries(fields ?? {})) {
      if (value !== null && value !== undefined) params.set(`${group}.${field}`, String(value));
    }
  }
  return params;
}
