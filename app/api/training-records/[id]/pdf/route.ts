import { z } from 'zod';
import { searchParamsObject, withRole } from '@/lib/http/api';
import { trainingRecordPdf } from '@/lib/data/qualification/training-records';

export const runtime = 'nodejs';

const paramsSchema = z.object({ id: z.coerce.number().int().positive() });
const querySchema = z.object({ paper: z.enum(['a4', 'letter']).optional() }).strict();

// GET /api/training-records/:id/pdf - the record of training as a PDF (A4 or Letter; default by the person's units), for the trainee it names, the cohort's instructor or an admin
export const GET = withRole<{ id: string }>(['trainee', 'instructor', 'admin'], async (request, user, { params }) => {
  const { id } = paramsSchema.parse(await params);
  const { paper } = querySchema.parse(searchParamsObject(request));
  const { bytes, fileName } = await trainingRecordPdf(user, id, paper);
  return new Response(Buffer.from(bytes), {
    headers: { 'content-type': 'application/pdf', 'content-disposition': `attachment; filename="${fileName}"` },
  });
});
