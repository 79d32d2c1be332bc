import { BadRequestException, type ArgumentMetadata, Injectable, type PipeTransform } from '@nestjs/common';
import { parseId } from '@morrowline/shared';

/**
 * A path id, strictly: 1 to 16 decimal digits, no sign, no leading zero, within the safe integer
 * range. Nest's ParseIntPipe reads " 1", "0x10" and "1e3" as 1, 16 and 1000, so a request could
 * reach a record its URL does not plainly name.
 */
@Injectable()
export class ParseIdPipe implements PipeTransform<unknown, number> {
  transform(value: unknown, metadata: ArgumentMetadata): number {
    const id = parseId(value);
    if (id === null) {
      const name = metadata.data ?? 'id';
      const shown = typeof value === 'string' ? JSON.stringify(value.length > 40 ? `${value.slice(0, 40)}…` : value) : String(value);
      throw new BadRequestException(`${name} ${shown} is not an id: a whole number from 1, in plain digits`);
    }
    return id;
  }
}
