import { z } from 'zod';
import type { EndpointDef } from './endpoint';

const errorBody = z.object({
  error: z.object({ code: z.string(), message: z.string(), details: z.unknown().optional() }),
});

function jsonSchema(schema: z.ZodType, io: 'input' | 'output'): Record<string, unknown> {
  const { $schema: _ignored, ...rest } = z.toJSONSchema(schema, {
    target: 'draft-2020-12',
    io,
    unrepresentable: 'any',
  });
  return rest;
}

function parameters(schema: z.ZodType | undefined, location: 'path' | 'query') {
  if (!(schema instanceof z.ZodObject)) return [];
  const properties = (jsonSchema(schema, 'input')['properties'] ?? {}) as Record<
    string,
    Record<string, unknown>
  >;
  const required = new Set((jsonSchema(schema, 'input')['required'] as string[] | undefined) ?? []);
  return Object.entries(properties).map(([name, property]) => ({
    name,
    in: location,
    required: location === 'path' || required.has(name),
    schema: property,
  }));
}

/** The OpenAPI 3.1 document for the given endpoints, served under `serverUrl`. */
export function buildOpenApiDocument(
  endpoints: readonly EndpointDef[],
  info: { title: string; version: string; serverUrl: string },
) {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const def of endpoints) {
    const path = def.path.replace(/:([A-Za-z0-9_]+)/g, '{$1}');
    const status = String(def.status ?? 200);
    paths[path] ??= {};
    paths[path][def.method] = {
      summary: def.summary,
      tags: def.tags,
      'x-permission': def.permission,
      parameters: [...parameters(def.params, 'path'), ...parameters(def.query, 'query')],
      ...(def.body && {
        requestBody: {
          required: true,
          content: { 'application/json': { schema: jsonSchema(def.body, 'input') } },
        },
      }),
      responses: {
        [status]: {
          description: 'Success',
          ...(def.response && {
            content: { 'application/json': { schema: jsonSchema(def.response, 'output') } },
          }),
        },
        default: {
          description: 'Error',
          content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } },
        },
      },
    };
  }
  return {
    openapi: '3.1.0',
    info: { title: info.title, version: info.version },
    servers: [{ url: info.serverUrl }],
    paths,
    components: { schemas: { Error: jsonSchema(errorBody, 'output') } },
  };
}
