import { DataTypes, type Model, type ModelStatic, type Sequelize } from 'sequelize';

export interface AuditEventAttributes {
  id: string;
  /** Null for account events (sign-in, password reset), which form their own chain. */
  orgId: string | null;
  /** Position in its chain, from 1. */
  seq: number;
  at: Date;
  actorUserId: string | null;
  action: string;
  targetType: string;
  targetId: string | null;
  details: Record<string, unknown>;
  prevHash: string;
  hash: string;
}
export type AuditEventRow = Model<AuditEventAttributes, AuditEventAttributes> &
  AuditEventAttributes;

export function defineAuditEvent(sequelize: Sequelize): ModelStatic<AuditEventRow> {
  return sequelize.define<AuditEventRow>(
    'AuditEvent',
    {
      id: { type: DataTypes.UUID, primaryKey: true },
      orgId: { type: DataTypes.UUID, allowNull: true },
      // bigint comes back as a string from pg; the chain stays far below 2^53.
      seq: {
        type: DataTypes.BIGINT,
        allowNull: false,
        get() {
          return Number(this.getDataValue('seq'));
        },
      },
      at: { type: DataTypes.DATE, allowNull: false },
      actorUserId: { type: DataTypes.UUID, allowNull: true },
      action: { type: DataTypes.TEXT, allowNull: false },
      targetType: { type: DataTypes.TEXT, allowNull: false },
      targetId: { type: DataTypes.TEXT, allowNull: true },
      details: { type: DataTypes.JSONB, allowNull: false },
      prevHash: { type: DataTypes.TEXT, allowNull: false },
      hash: { type: DataTypes.TEXT, allowNull: false },
    },
    { tableName: 'audit_events', timestamps: false },
  );
}
