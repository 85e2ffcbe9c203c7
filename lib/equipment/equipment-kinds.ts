export const EQUIPMENT_KINDS = ['torque_wrench', 'tensioner_pump', 'pump_gauge', 'load_cell', 'logger'] as const;
export type EquipmentKind = (typeof EQUIPMENT_KINDS)[number];

export const EQUIPMENT_KIND_LABELS: Record<EquipmentKind, string> = {
  torque_wrench: 'Torque wrench',
  tensioner_pump: 'Tensioner pump',
  pump_gauge: 'Pump gauge',
  load_cell: 'Load cell',
  logger: 'Logger',
};
