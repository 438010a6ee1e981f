// Invented demo photos: simple drawn pictures of a wall (wood-tone boards, a window), made on the
// fly so no image files are committed. They go through the same clean-up as a homeowner's photo.
import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import sharp from 'sharp';
import type { Company } from '../companies/company.entity';
import { Lead } from '../leads/lead.entity';
import { LeadPhoto } from '../photos/lead-photo.entity';
import { cleanPhoto } from '../photos/photo-content';
import { putObject } from '../storage/s3';

function wallPicture(tone: string, boards: number): Buffer {
  const lines = Array.from(
    { length: boards },
    (_, i) => `<line x1="${(i + 1) * (1200 / (boards + 1))}" y1="380" x2="${(i + 1) * (1200 / (boards + 1))}" y2="900" stroke="#6E5A3E" stroke-width="4"/>`,
  ).join('');
  return Buffer.from(`<svg xmlns="http://www.w3.org/2000/svg" width="1200" height="900">
    <rect width="1200" height="900" fill="#F3EFE6"/>
    <rect x="0" y="380" width="1200" height="520" fill="${tone}"/>${lines}
    <rect x="0" y="360" width="1200" height="24" fill="#DCC59A" stroke="#6E5A3E" stroke-width="3"/>
    <rect x="430" y="90" width="340" height="240" fill="#CFE3EA" stroke="#1F2A2E" stroke-width="8"/>
    <rect x="0" y="860" width="1200" height="40" fill="#E9E2D3"/>
  </svg>`);
}

/** Gives the three newest demo leads of a firm two photos each, once. */
export async function seedDemoPhotos(em: EntityManager, company: Company): Promise<number> {
  if ((await em.count(LeadPhoto, { company })) > 0) return 0;
  const leads = await em.find(Lead, { company }, { orderBy: { createdAt: 'desc' }, limit: 3 });
  let added = 0;
  for (const [index, lead] of leads.entries()) {
    for (const [n, tone] of ['#E8D3AC', '#F7F3EA'].entries()) {
      const png = await sharp(wallPicture(tone, 6 + index * 3 + n))
        .png()
        .toBuffer();
      const clean = await cleanPhoto(png);
      const id = randomUUID();
      const imageKey = `photos/${company.id}/${id}.jpg`;
      const thumbKey = `thumbs/${company.id}/${id}.jpg`;
      await putObject(imageKey, clean.image, 'image/jpeg');
      await putObject(thumbKey, clean.thumbnail, 'image/jpeg');
      em.create(LeadPhoto, {
        id,
        company,
        draftId: randomUUID(),
        lead,
        status: 'ready',
        uploadKey: `uploads/${company.id}/seed/${id}`,
        imageKey,
        thumbKey,
        width: clean.width,
        height: clean.height,
        bytes: clean.image.length,
        originalName: `wall-${n + 1}.jpg`,
      });
      added++;
    }
  }
  await em.flush();
  return added;
}
