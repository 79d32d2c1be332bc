import { BadRequestException } from '@nestjs/common';
import { ParseIdPipe } from './parse-id.pipe';

describe('ParseIdPipe', () => {
  const pipe = new ParseIdPipe();
  const meta = { type: 'param' as const, data: 'id' };

  it('answers the number of a plain id', () => {
    expect(pipe.transform('17', meta)).toBe(17);
  });

  it.each([' 1', '0x10', '1e3', '0', '-1', '01', '1.5', '9007199254740993', ''])('refuses %j with a 400 naming it', (text) => {
    expect(() => pipe.transform(text, meta)).toThrow(BadRequestException);
    expect(() => pipe.transform(text, meta)).toThrow(`id ${JSON.stringify(text)} is not an id: a whole number from 1, in plain digits`);
  });
});
