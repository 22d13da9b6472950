import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

export interface YarnAttributes {
  id: number;
  ownerId: number;
  name: string;
  fibre: string;
  /** '#rrggbb'. */
  colour: string;
  /** The count as the weaver writes it ("2/8", "20/2 Nm"); the plan reads it, the stash keeps it as given. */
  count: string;
  yardsPerPound: number | null;
  createdAt: Date;
  updatedAt: Date;
}
export type YarnCreation = Optional<YarnAttributes, 'id' | 'fibre' | 'count' | 'yardsPerPound' | 'createdAt' | 'updatedAt'>;
export interface YarnRow extends Model<YarnAttributes, YarnCreation>, YarnAttributes {}
export type YarnModel = ModelStatic<YarnRow>;

/** A yarn in one weaver's stash. */
export function defineYarn(sequelize: Sequelize): YarnModel {
  return sequelize.define<YarnRow>('Yarn', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    ownerId: { type: DataTypes.INTEGER, allowNull: false },
    name: { type: DataTypes.STRING(100), allowNull: false },
    fibre: { type: DataTypes.STRING(100), allowNull: false, defaultValue: '' },
    colour: { type: DataTypes.CHAR(7), allowNull: false },
    count: { type: DataTypes.STRING(50), allowNull: false, defaultValue: '' },
    yardsPerPound: { type: DataTypes.DOUBLE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  }, { tableName: 'yarns' });
}
