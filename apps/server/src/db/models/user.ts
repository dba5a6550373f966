import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

export interface UserAttributes {
  id: string;
  /** Stored lower-case; unique regardless of case. */
  email: string;
  name: string;
  /** argon2id PHC string. */
  passwordHash: string;
  /** Set by the installation's operator: the person cannot sign in anywhere. */
  disabled: boolean;
  createdAt: Date;
  updatedAt: Date;
}
type Creation = Optional<UserAttributes, 'id' | 'disabled' | 'createdAt' | 'updatedAt'>;
export type UserRow = Model<UserAttributes, Creation> & UserAttributes;

export function defineUser(sequelize: Sequelize): ModelStatic<UserRow> {
  return sequelize.define<UserRow>(
    'User',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      email: { type: DataTypes.TEXT, allowNull: false },
      name: { type: DataTypes.TEXT, allowNull: false },
      passwordHash: { type: DataTypes.TEXT, allowNull: false },
      disabled: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { tableName: 'users' },
  );
}
