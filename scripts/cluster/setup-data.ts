import fs from 'node:fs';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import { loadConfig } from '../../server/config';
import { createSequelize } from '../../server/db';
import { Project, RuleSetRecord, User, UserRole } from '../../server/db/models';
import { hashPassword } from '../../server/auth/password';
import { seedRuleSets } from '../../server/rule-sets/seed-rule-sets';
import type { Role } from '../../shared/authz/roles';

export interface RunData {
  projectId: number;
  ruleSetId: number;
  password: string;
  input: Record<string, unknown>;
  teams: { author: string; checker: string; approver: string }[];
}

/** Standards, one project and an author, checker and approver per client (the cluster test and the bench). */
export async function setUpData(
  env: NodeJS.ProcessEnv,
  clients: number,
  project = { code: 'CLUSTER-RUN', name: 'Cluster run' },
): Promise<RunData> {
  const sequelize = createSequelize(loadConfig(env));
  try {
    await seedRuleSets(sequelize);
    const password = `cluster-${randomUUID()}`;
    const passwordHash = await hashPassword(password);
    const person = async (role: Role, i: number) => {
      const username = `${project.code.toLowerCase()}-${role}-${i}`;
      const user = await User.create({
        username,
        displayName: `${project.name} ${role} ${i}`,
        email: `${username}@example.test`,
        passwordHash,
      });
      await UserRole.create({ userId: user.id, role });
      return username;
    };
    const teams = [];
    for (let i = 1; i <= clients; i++)
      teams.push({
        author: await person('author', i),
        checker: await person('checker', i),
        approver: await person('approver', i),
      });
    const created = await Project.create({ ...project, createdBy: null });
    const ruleSet = await RuleSetRecord.findOne({
      where: { code: 'KFD-ENG-014', status: 'effective' },
      order: [['version', 'DESC']],
    });
    if (!ruleSet) throw new Error('no effective KFD-ENG-014 after seeding the standards');
    const input = JSON.parse(fs.readFileSync(path.resolve('test/fixtures/calcs/five-segment-fatigue.json'), 'utf8'));
    return { projectId: created.id, ruleSetId: ruleSet.id, password, input, teams };
  } finally {
    await sequelize.close();
  }
}
