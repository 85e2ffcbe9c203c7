import type { Metadata } from 'next';
import { HardwareForms } from '@/components/joints/hardware-forms';
import { listHardware } from '@/lib/data/hardware';
import { JOINT_LIBRARY_ROLES, listJointLibrary } from '@/lib/data/joints';
import { requirePageUser } from '@/lib/auth/session';
import { createHardwareSetAction, createLubricantLotAction, updateConditionAction } from './actions';

export const metadata: Metadata = { title: 'Hardware and lubricant lots' };

export default async function HardwarePage() {
  const user = await requirePageUser(JOINT_LIBRARY_ROLES);
  const [hardware, library] = await Promise.all([listHardware(user), listJointLibrary(user)]);
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-semibold">Hardware and lubricant lots</h1>
      <p className="text-sm text-muted">Studs, nuts and washers are reused until they gall: each run recorded on a set raises its use count by one.</p>
      <HardwareForms
        sets={hardware.sets}
        lots={hardware.lots}
        lubricants={library.lubricants.map((l) => ({ id: l.id, name: l.name }))}
        createSet={createHardwareSetAction}
        updateCondition={hardware.sets.map((s) => updateConditionAction.bind(null, s.id))}
        createLot={createLubricantLotAction}
      />
    </div>
  );
}
