import { DEMO_USERS } from '../../../server/db/demo-data';

describe('demo accounts', () => {
  it('when a standard change is tried in the demo, then two different compliance people can propose and confirm it', () => {
    const compliance = DEMO_USERS.filter((u) => u.roles.includes('compliance'));
    expect(new Set(compliance.map((u) => u.username)).size).toBeGreaterThanOrEqual(2);
    expect(new Set(compliance.map((u) => u.displayName)).size).toBe(compliance.length);
  });
});
