import { plainToInstance } from 'class-transformer';
import { IsInt, validateSync } from 'class-validator';
import { ToInteger } from './to-integer';

class Query {
  @ToInteger() @IsInt() limit!: number;
}

function read(limit: unknown): { value: unknown; errors: number } {
  const query = plainToInstance(Query, { limit });
  return { value: query.limit, errors: validateSync(query).length };
}

describe('ToInteger', () => {
  it('reads plain whole numbers, and leaves JSON numbers as they are', () => {
    expect(read('20')).toEqual({ value: 20, errors: 0 });
    expect(read('-3')).toEqual({ value: -3, errors: 0 });
    expect(read('0')).toEqual({ value: 0, errors: 0 });
    expect(read(7)).toEqual({ value: 7, errors: 0 });
  });

  it.each(['0x10', '1e3', ' 5', '5 ', '', '05', '1.0', '+5'])('leaves %j as text for @IsInt() to refuse', (text) => {
    expect(read(text)).toEqual({ value: text, errors: 1 });
  });
});
