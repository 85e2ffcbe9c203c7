/**
 * Invented pathological upload files of 19.9 MB (1 MB = 1,048,576 bytes), shared by the upload
 * tests and the bench: one line of commas; a header and then a quoted cell that never closes
 * (over many short lines); a header and then only newlines. Each has the line a refusal names.
 */
const MB = 1024 * 1024;
export const PATHOLOGICAL_SIZE = Math.round(19.9 * MB);
const HEADER = 'Time (s),Stud 1 [kN],Stud 2 [kN],Stud 3 [kN],Stud 4 [kN]\n';

function filled(prefix: string, byte: number, every?: { byte: number; step: number }): Uint8Array {
  const bytes = new Uint8Array(PATHOLOGICAL_SIZE).fill(byte);
  if (every) for (let i = prefix.length + every.step; i < bytes.length; i += every.step) bytes[i] = every.byte;
  bytes.set(new TextEncoder().encode(prefix));
  return bytes;
}

export function pathologicalFiles(): Array<{ name: string; bytes: Uint8Array; line: number; message: RegExp }> {
  return [
    { name: 'one line of commas', bytes: filled('Time (s),Stud 1', 0x2c), line: 1, message: /^Line 1: the line is longer than/ },
    { name: 'a quoted cell that never closes', bytes: filled(`${HEADER}0,"`, 0x78, { byte: 0x0a, step: 80 }), line: 2, message: /^Line 2: a quoted cell starts here/ },
    { name: 'a header and then newlines', bytes: filled(HEADER, 0x0a), line: 1002, message: /^Line 1002: more than 1,000 blank lines in a row/ },
  ];
}
