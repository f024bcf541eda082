/**
 * Holds real answers of the API to the OpenAPI document (server/openapi/) with ajv, a
 * general-purpose JSON Schema 2020-12 validator (the dialect of OpenAPI 3.1).
 */
import { expect } from 'vitest';
import { Ajv2020 } from 'ajv/dist/2020.js';
import type { OpenApiDocument } from '../../server/openapi/document';

export type Operation = {
  responses: Record<string, { $ref?: string; content?: Record<string, { schema: object }> }>;
  requestBody?: { content: Record<string, { schema: object; example?: unknown }> };
  parameters?: { name: string; in: string }[];
};

/** The validators of one document: schemas refer to each other as #/components/schemas/X. */
export function documentChecks(doc: OpenApiDocument) {
  const ajv = new Ajv2020({ strict: false, validateFormats: false, allErrors: true });
  ajv.addSchema({ $id: 'openapi.json', components: doc.components });
  const validatorFor = (schema: object) => ajv.compile(JSON.parse(JSON.stringify(schema).replaceAll('"#/components/', '"openapi.json#/components/')) as object);

  /** The schema of an operation's answer with `status` (JSON), followed through a $ref to components.responses. */
  function responseSchema(method: string, path: string, status: number): object {
    const op = (doc.paths as Record<string, Record<string, Operation>>)[path]?.[method];
    if (!op) throw new Error(`${method.toUpperCase()} ${path} is not in the document`);
    let response = op.responses[String(status)];
    if (!response) throw new Error(`${method.toUpperCase()} ${path} documents no ${status}`);
    if (response.$ref) response = (doc.components.responses as Record<string, typeof response>)[response.$ref.split('/').pop()!];
    return response.content!['application/json'].schema;
  }

  /** Checks a real answer against the document; fails naming the fields at fault. */
  function expectDocumented(method: string, path: string, res: { status: number; body: unknown }) {
    const validate = validatorFor(responseSchema(method, path, res.status));
    const ok = validate(res.body);
    expect(ok ? [] : validate.errors, `${method.toUpperCase()} ${path} → ${res.status} against the document`).toEqual([]);
  }

  return { validatorFor, expectDocumented };
}
