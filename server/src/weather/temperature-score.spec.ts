import { temperatureScore } from './temperature-score';

describe('a temperature forecast\'s error', () => {
  it('is the mean absolute error and the bias over the hours with both values', () => {
    // Errors +1, −3 and +2 (the null hours left out): MAE 2, bias 0, worked by hand.
    expect(temperatureScore([1, 5, null, 0, 4], [2, 2, 7, null, 6])).toEqual({ hours: 3, maeC: 2, biasC: 0 });
    expect(temperatureScore([null], [1])).toEqual({ hours: 0, maeC: null, biasC: null });
  });
});
