import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';
import type { Role } from '@biasproof/shared';

export interface InvitationAttributes {
  id: string;
  orgId: string;
  email: string;
  roles: Role[];
  /** SHA-256 (hex) of the token in the e-mailed link; the token itself is never stored. */
  tokenHash: string;
  invitedByUserId: string;
  expiresAt: Date;
  acceptedAt: Date | null;
  acceptedByUserId: string | null;
  revokedAt: Date | null;
  createdAt: Date;
  updatedAt: Date;
}
type Creation = Optional<
  InvitationAttributes,
  'id' | 'acceptedAt' | 'acceptedByUserId' | 'revokedAt' | 'createdAt' | 'updatedAt'
>;
export type InvitationRow = Model<InvitationAttributes, Creation> & InvitationAttributes;

export function defineInvitation(sequelize: Sequelize): ModelStatic<InvitationRow> {
  return sequelize.define<InvitationRow>(
    'Invitation',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      orgId: { type: DataTypes.UUID, allowNull: false },
      email: { type: DataTypes.TEXT, allowNull: false },
      roles: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false },
      tokenHash: { type: DataTypes.TEXT, allowNull: false },
      invitedByUserId: { type: DataTypes.UUID, allowNull: false },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      acceptedAt: { type: DataTypes.DATE, allowNull: true },
      acceptedByUserId: { type: DataTypes.UUID, allowNull: true },
      revokedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { tableName: 'invitations' },
  );
}
