import { errorResponse } from '@/lib/http/api';
import { AppError } from '@/lib/http/errors';
import { clientAddress } from '@/lib/auth/auth-options';
import { reviewedPackage } from '@/lib/data/review-links';

export const dynamic = 'force-dynamic';

// GET /api/review/:token/package - public: the data package of the saved comparison a review link opens, trainees pseudonymised (404 for a wrong, expired or withdrawn link; 429 when the address looked up too often)
export async function GET(request: Request, { params }: { params: Promise<{ token: string }> }) {
  try {
    const { token } = await params;
    const answer = await reviewedPackage(token.slice(0, 100), clientAddress(Object.fromEntries(request.headers)));
    if (answer.kind === 'rate_limited') throw new AppError('rate_limited', 'Too many look-ups from your address. Wait 15 minutes, then try again.');
    const { fileName, bytes } = answer.value;
    return new Response(Buffer.from(bytes), {
      headers: { 'content-type': 'application/zip', 'content-disposition': `attachment; filename="${fileName}"`, 'cache-control': 'private, no-store' },
    });
  } catch (error) {
    return errorResponse(error);
  }
}
