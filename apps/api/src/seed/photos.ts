import sharp from 'sharp';
import { CalloutSchema } from '../modules/photos/callout.entity';
import { savePhoto } from '../modules/photos/photos.service';
import { PartSchema, type Part } from '../modules/parts/part.entity';
import { TeardownSchema } from '../modules/teardowns/teardown.entity';
import { UserSchema } from '../modules/users/user.entity';
import type { SeedContext } from './context';
import { illustrationsFor, type IllustrationPin } from './photo-illustrations';
import { DEMO_DEVICES, teardownRef } from './scenario';

/** Rendered pictures by SVG text: a second seed in the same process (tests) skips the drawing. */
const rendered = new Map<string, Promise<Buffer>>();
const render = (svg: string) => {
  let jpeg = rendered.get(svg);
  if (!jpeg) rendered.set(svg, (jpeg = sharp(Buffer.from(svg)).jpeg({ quality: 88 }).toBuffer()));
  return jpeg;
};

/** The part a pin should point at: same category, description matching when a pattern is given. */
export function matchPart(parts: Part[], pin: IllustrationPin): Part | null {
  if (!pin.match) return null;
  const { category, pattern } = pin.match;
  const same = parts.filter((p) => p.category === category);
  return (pattern ? same.find((p) => pattern.test(`${p.description} ${p.marking ?? ''}`)) : undefined) ?? (pattern ? null : same[0]) ?? null;
}

/**
 * Demo photos: 3–4 illustrations per demo teardown, drawn as SVG and stored through the same
 * processing as uploads (sniffing, metadata stripping, thumbnail and display image, random names),
 * with numbered pins linked to the teardown's parts where parts exist.
 */
export async function seedPhotos(ctx: SeedContext): Promise<void> {
  const { em } = ctx;
  const engineer2 = await em.findOne(UserSchema, { email: 'engineer2@splitcase.test' });
  for (const d of DEMO_DEVICES) {
    const teardownId = ctx.refs.get(teardownRef(d.key)) as number | undefined;
    if (!teardownId) continue;
    const teardown = await em.findOneOrFail(TeardownSchema, { id: teardownId });
    const parts = await em.find(PartSchema, { teardown: teardownId }, { orderBy: { position: 'asc', id: 'asc' } });
    for (const [i, ill] of illustrationsFor(d).entries()) {
      const jpeg = await render(ill.svg);
      const photo = await savePhoto(em, ctx.env.uploadsDir, {
        teardown,
        buffer: jpeg,
        clientName: `demo-${d.key}-${i + 1}.jpg`,
        caption: ill.caption,
        layer: ill.layer,
        step: ill.step,
        uploadedBy: d.teardown.engineer === 'engineer' ? ctx.users.engineer.id : (engineer2?.id ?? null),
      });
      ill.pins.forEach((pin, n) => {
        em.create(CalloutSchema, { photo, number: n + 1, x: pin.x, y: pin.y, label: pin.label, part: matchPart(parts, pin), finding: null } as never);
      });
      await em.flush();
    }
  }
}
