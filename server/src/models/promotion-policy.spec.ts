import { decidePromotion, type PromotionCase } from './promotion-policy';

const nightly: PromotionCase = { inServiceId: 4, mode: 'full', trigger: 'schedule', candidateMape: 3.1, inServiceMape: 3.4 };

describe('decidePromotion', () => {
  it('puts the first model of a zone into service whatever its score', () => {
    expect(decidePromotion({ ...nightly, inServiceId: null, candidateMape: 50, inServiceMape: null })).toEqual({ promoted: true, why: 'the first model of the zone goes into service' });
    expect(decidePromotion({ ...nightly, inServiceId: null, trigger: 'operator' }).promoted).toBe(true);
  });

  it('lets the hourly update replace the model in service', () => {
    expect(decidePromotion({ ...nightly, mode: 'update', trigger: 'update', candidateMape: 9, inServiceMape: 2 })).toEqual({ promoted: true, why: 'hourly update: same orders, coefficients re-estimated' });
  });

  it('promotes a nightly candidate only when its MAPE beats the model in service on the same days', () => {
    expect(decidePromotion(nightly)).toEqual({ promoted: true, why: 'scheduled refit: backtest MAPE 3.10 % beat 3.40 % of version 4' });
    expect(decidePromotion({ ...nightly, candidateMape: 3.4 })).toEqual({ promoted: false, why: 'kept version 4 in service: the candidate (MAPE 3.40 %) did not beat it (3.40 %)' });
    expect(decidePromotion({ ...nightly, candidateMape: 3.5 }).promoted).toBe(false);
  });

  it('says which side was scored with its weather terms on forecast weather', () => {
    expect(decidePromotion({ ...nightly, candidateOnWeather: true, inServiceOnWeather: false }).why).toBe('scheduled refit: backtest MAPE 3.10 % on forecast weather beat 3.40 % of version 4');
    expect(decidePromotion({ ...nightly, candidateMape: 3.6, candidateOnWeather: true, inServiceOnWeather: true }).why).toBe(
      'kept version 4 in service: the candidate (MAPE 3.60 % on forecast weather) did not beat it (3.40 % on forecast weather)',
    );
  });

  it('keeps the model in service when either side could not be scored', () => {
    expect(decidePromotion({ ...nightly, inServiceMape: null })).toEqual({ promoted: false, why: 'kept version 4 in service: the candidate (MAPE 3.10 %) did not beat it (– %)' });
    expect(decidePromotion({ ...nightly, candidateMape: null }).why).toBe('kept version 4 in service: the candidate (MAPE – %) did not beat it (3.40 %)');
  });

  it("leaves an operator's better candidate for the operator to promote", () => {
    expect(decidePromotion({ ...nightly, trigger: 'operator', candidateMape: 1 })).toEqual({ promoted: false, why: 'candidate stored; compare it with the model in service and promote it if it serves better' });
  });
});
