/** Bolted-joint calculations, pure and in SI calculation units (mm, mm², N, MPa, N·m). */
export * from './units';
export * from './thread';
export * from './grades';
export * from './preload';
export * from './torque';
export * from './tensioner';
export * from './nut-factors';
export * from './nut-bearing';
export * from './warnings';
export * from './calculate';
export * from './gasket';
export * from './tensioner-coverage';
