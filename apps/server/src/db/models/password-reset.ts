import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

export interface PasswordResetAttributes {
  id: string;
  userId: string;
  /** SHA-256 (hex) of the token in the e-mailed link. */
  tokenHash: string;
  expiresAt: Date;
  usedAt: Date | null;
  createdAt: Date;
}
type Creation = Optional<PasswordResetAttributes, 'id' | 'usedAt' | 'createdAt'>;
export type PasswordResetRow = Model<PasswordResetAttributes, Creation> & PasswordResetAttributes;

export function definePasswordReset(sequelize: Sequelize): ModelStatic<PasswordResetRow> {
  return sequelize.define<PasswordResetRow>(
    'PasswordReset',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      userId: { type: DataTypes.UUID, allowNull: false },
      tokenHash: { type: DataTypes.TEXT, allowNull: false },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      usedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { tableName: 'password_resets', updatedAt: false },
  );
}
