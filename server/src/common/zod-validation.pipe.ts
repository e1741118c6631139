import { BadRequestException, type PipeTransform } from '@nestjs/common';
import type { ErrorDetail } from '@stormhour/shared';
import type { z } from 'zod';

/** Validates a body or query against the same zod schema the client uses; unknown fields are dropped. */
export class ZodValidationPipe<S extends z.ZodType> implements PipeTransform<unknown, z.infer<S>> {
  constructor(
    private readonly schema: S,
    private readonly what = 'request body',
  ) {}

  transform(value: unknown): z.infer<S> {
    const result = this.schema.safeParse(value ?? {});
    if (result.success) return result.data;
    const details: ErrorDetail[] = result.error.issues.map((issue) => ({
      where: issue.path.length ? issue.path.join('.') : this.what,
      problem: issue.message,
    }));
    throw new BadRequestException({
      message: `The ${this.what} is not valid: ${details.map((d) => `${d.where}: ${d.problem}`).join('; ')}`,
      details,
    });
  }
}

export const zodBody = <S extends z.ZodType>(schema: S) => new ZodValidationPipe(schema);
export const zodQuery = <S extends z.ZodType>(schema: S) => new ZodValidationPipe(schema, 'query');
