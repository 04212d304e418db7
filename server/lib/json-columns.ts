import { MaterialsSchema, type Materials } from '../../src/schemas/materials.js';

// SQLite keeps JSON columns as text; these read them back without ever throwing on old or damaged rows.

export function parseJson<T>(text: string | null | undefined, fallback: T): T {
  if (!text) return fallback;
  try {
    return JSON.parse(text) as T;
  } catch {
    return fallback;
  }
}

/** Stored materials, normalised to the shared shape (older or partial JSON still reads). */
export function readMaterials(text: string | null | undefined): Materials {
  const parsed = MaterialsSchema.safeParse(parseJson(text, {}));
  return parsed.success ? parsed.data : { yarns: [], hooks: [], notions: [] };
}
