import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';
import type { Role } from '@biasproof/shared';

export interface MembershipAttributes {
  id: string;
  orgId: string;
  userId: string;
  roles: Role[];
  /** Set by an admin of the organization: the person may not use this organization. */
  disabled: boolean;
  createdAt: Date;
  updatedAt: Date;
}
type Creation = Optional<MembershipAttributes, 'id' | 'disabled' | 'createdAt' | 'updatedAt'>;
export type MembershipRow = Model<MembershipAttributes, Creation> & MembershipAttributes;

export function defineMembership(sequelize: Sequelize): ModelStatic<MembershipRow> {
  return sequelize.define<MembershipRow>(
    'Membership',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      orgId: { type: DataTypes.UUID, allowNull: false },
      userId: { type: DataTypes.UUID, allowNull: false },
      roles: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false },
      disabled: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { tableName: 'memberships' },
  );
}
