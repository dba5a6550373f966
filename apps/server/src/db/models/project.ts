import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

export interface ProjectAttributes {
  id: string;
  orgId: string;
  name: string;
  /** Upper case, unique in the organization. */
  code: string;
  description: string;
  /** Archived projects are read-only containers; projects are never deleted. */
  archived: boolean;
  createdByUserId: string;
  createdAt: Date;
  updatedAt: Date;
}
type Creation = Optional<
  ProjectAttributes,
  'id' | 'description' | 'archived' | 'createdAt' | 'updatedAt'
>;
export type ProjectRow = Model<ProjectAttributes, Creation> & ProjectAttributes;

export function defineProject(sequelize: Sequelize): ModelStatic<ProjectRow> {
  return sequelize.define<ProjectRow>(
    'Project',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      orgId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.TEXT, allowNull: false },
      code: { type: DataTypes.TEXT, allowNull: false },
      description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      archived: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      createdByUserId: { type: DataTypes.UUID, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { tableName: 'projects' },
  );
}
