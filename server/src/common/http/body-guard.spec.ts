import { bodyProblem } from './body-guard';

function nested(levels: number): unknown {
  let value: unknown = 1;
  for (let i = 0; i < levels; i += 1) value = { a: value };
  return value;
}

describe('bodyProblem', () => {
  it('passes an ordinary body', () => {
    expect(bodyProblem({ name: 'Millrace', items: [{ text: 'a', tags: ['x'] }], n: null })).toBeNull();
    expect(bodyProblem(undefined)).toBeNull();
    expect(bodyProblem('text')).toBeNull();
  });

  it('passes 32 levels of nesting and refuses 33', () => {
    expect(bodyProblem(nested(32))).toBeNull();
    expect(bodyProblem(nested(33))).toBe('The body is nested more than 32 levels deep');
  });

  it('refuses 3,000 levels of arrays without overflowing the stack', () => {
    const deep = JSON.parse(`${'['.repeat(3000)}${']'.repeat(3000)}`) as unknown;
    expect(bodyProblem(deep)).toBe('The body is nested more than 32 levels deep');
  });

  it.each(['__proto__', 'constructor', 'prototype'])('refuses a %s key at any depth, naming where', (key) => {
    expect(bodyProblem(JSON.parse(`{"items":[{"${key}":{"polluted":true}}]}`))).toBe(`body.items[0] has a key "${key}", which no request may carry`);
  });
});
