import type { SchemaObject } from '@nestjs/swagger';
import { z } from 'zod';

/** The OpenAPI schema of a request body, from the same zod schema that validates it. */
export function jsonSchema(schema: z.ZodType): SchemaObject {
  return z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' }) as SchemaObject;
}
