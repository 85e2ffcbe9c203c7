import { withRole } from '@/lib/http/api';
import { savedComparisonPackage } from '@/lib/data/saved-comparisons';

// GET /api/compare/saved/:slug/package - the saved comparison as a data package (zip): datapackage.json, CSV tables, manifest, Python script
export const GET = withRole<{ slug: string }>(['instructor', 'researcher'], async (_request, user, { params }) => {
  const { slug } = await params;
  const { fileName, bytes } = await savedComparisonPackage(user, slug);
  return new Response(Buffer.from(bytes), {
    headers: { 'content-type': 'application/zip', 'content-disposition': `attachment; filename="${fileName}"` },
  });
});
