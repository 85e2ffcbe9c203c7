import type { Transaction } from 'sequelize';
import { AppError } from '../../http/errors';
import { HardwareSet } from '../../../models';

/**
 * Raises a hardware set's use count by one inside the run's transaction (the row held FOR UPDATE, so
 * two runs stored at once get numbers one apart) and returns the run's use number (1 = first run).
 */
export async function claimHardwareUse(hardwareSetId: number, transaction: Transaction): Promise<number> {
  const set = await HardwareSet.findByPk(hardwareSetId, { transaction, lock: transaction.LOCK.UPDATE });
  if (!set) throw new AppError('invalid_input', 'That hardware set does not exist. Choose one from the list.', { field: 'hardwareSetId' });
  const useCount = set.useCount + 1;
  await set.update({ useCount }, { transaction });
  return useCount;
}
