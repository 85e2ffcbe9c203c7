import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * How many studs a method's tool set pulls at once: a tool on every stud (100 % tensioner coverage),
 * on every second stud (50 %), or one tool moved stud by stud. Existing methods keep the behaviour
 * they had (the simulator pulled a library method stud by stud): `one_stud`.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('methods', 'tensioner_coverage', {
    type: DataTypes.ENUM('every_stud', 'every_second_stud', 'one_stud'),
    allowNull: false,
    defaultValue: 'one_stud',
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('methods', 'tensioner_coverage');
};
