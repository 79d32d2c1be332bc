import { BadRequestException, type ArgumentMetadata, Injectable, type PipeTransform } from '@nestjs/common';
import { parseDay } from '@morrowline/shared';

/** An operating day in the path, read by the one day parser (YYYY-MM-DD, a real date in the window). */
@Injectable()
export class ParseDayPipe implements PipeTransform<unknown, string> {
  transform(value: unknown, metadata: ArgumentMetadata): string {
    const result = parseDay(value, metadata.data ?? 'day');
    if (!result.ok) throw new BadRequestException(result.message);
    return result.value;
  }
}
