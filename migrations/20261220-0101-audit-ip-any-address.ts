import { DataTypes, type QueryInterface } from 'sequelize';

/*
 * The audit `ip` column holds any address text the server records: IPv6 with a zone id
 * (fe80::1%eth0) or an IPv4-mapped form is longer than a dotted quad, and the address check in
 * server/http/client-ip.ts allows up to 255 characters. ALTER TABLE fires no row triggers, so the
 * append-only triggers of audit_events are untouched.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.changeColumn('audit_events', 'ip', { type: DataTypes.STRING(255), allowNull: true });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.changeColumn('audit_events', 'ip', { type: DataTypes.STRING(64), allowNull: true });
}
