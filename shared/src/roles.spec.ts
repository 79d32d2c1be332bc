import { may, ROLES, type Permission, type Role } from './roles';

const holders = (permission: Permission): Role[] => ROLES.filter((role) => may(role, permission));

describe('who may do what', () => {
  it('lets operators and supervisors do the forecasting work, and viewers only read it', () => {
    expect(holders('forecast')).toEqual(['operator', 'supervisor']);
    expect(holders('readForecasts')).toEqual(['viewer', 'operator', 'supervisor']);
    expect(holders('supervise')).toEqual(['supervisor']);
  });

  it('keeps the work in progress (drafts, handovers, model internals) from viewers and admin', () => {
    expect(holders('readDeskWork')).toEqual(['operator', 'supervisor']);
  });

  it('keeps admin (IT) out of forecasting decisions but gives it administration, live load and the audit trail', () => {
    expect(may('admin', 'forecast')).toBe(false);
    expect(may('admin', 'readForecasts')).toBe(false);
    expect(holders('administer')).toEqual(['admin']);
    expect(holders('readAudit')).toEqual(['supervisor', 'admin']);
    expect(holders('signedIn')).toEqual(['viewer', 'operator', 'supervisor', 'admin']);
  });

  it('lets supervisors and admins keep the holiday calendar, not operators or viewers', () => {
    expect(holders('editCalendar')).toEqual(['supervisor', 'admin']);
  });
});
