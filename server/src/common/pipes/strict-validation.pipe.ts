import { type ArgumentMetadata, ValidationPipe } from '@nestjs/common';

/**
 * Nest's ValidationPipe, but a single path or query value (`@Param('id') id: number`) is handed on
 * as the text that came. The stock pipe converts it with Number() first, so " 1", "0x10" and
 * "1e3" arrived as 1, 16 and 1000 before any stricter pipe (ParseIdPipe) could see the text.
 * DTOs are still transformed and validated as before.
 */
export class StrictValidationPipe extends ValidationPipe {
  protected override transformPrimitive(value: unknown, _metadata: ArgumentMetadata): unknown {
    return value;
  }
}
