import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

export interface OrganizationAttributes {
  id: string;
  slug: string;
  name: string;
  /** IANA time zone for showing dates, e.g. `Europe/Berlin`. */
  timezone: string;
  settings: Record<string, unknown>;
  createdAt: Date;
  updatedAt: Date;
}
type Creation = Optional<
  OrganizationAttributes,
  'id' | 'timezone' | 'settings' | 'createdAt' | 'updatedAt'
>;
export type OrganizationRow = Model<OrganizationAttributes, Creation> & OrganizationAttributes;

export function defineOrganization(sequelize: Sequelize): ModelStatic<OrganizationRow> {
  return sequelize.define<OrganizationRow>(
    'Organization',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      slug: { type: DataTypes.TEXT, allowNull: false },
      name: { type: DataTypes.TEXT, allowNull: false },
      timezone: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'UTC' },
      settings: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { tableName: 'organizations' },
  );
}
