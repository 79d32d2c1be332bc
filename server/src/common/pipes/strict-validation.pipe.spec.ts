import { StrictValidationPipe } from './strict-validation.pipe';

describe('StrictValidationPipe', () => {
  it('hands a path value on as the text that came, so ParseIdPipe sees " 1" and "0x10"', async () => {
    const pipe = new StrictValidationPipe({ transform: true });
    for (const text of [' 1', '0x10', '1e3', '17']) {
      expect(await pipe.transform(text, { type: 'param', metatype: Number, data: 'id' })).toBe(text);
    }
  });
});
