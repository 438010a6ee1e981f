import type { EntityManager } from '@mikro-orm/postgresql';
import type { MailTemplateInput, MailTemplateView } from '~/lib/shared/inquiry-work-schemas';
import { isId } from '~/lib/shared/ids';
import { InvalidInput, NotFound } from '../errors';
import { MailTemplate } from './mail-template.entity';

/** A firm may keep this many templates: a picker longer than that stops helping. common practice, no source. */
export const MAX_TEMPLATES = 30;

export const presentTemplate = (t: MailTemplate): MailTemplateView => ({ id: t.id, name: t.name, subject: t.subject, body: t.body });

/** The firm's templates in their order. */
export function templatesOfFirm(em: EntityManager, companyId: string): Promise<MailTemplate[]> {
  return em.find(MailTemplate, { company: companyId }, { orderBy: { position: 'asc', createdAt: 'asc' } });
}

/** One of the firm's templates; another firm's or a malformed id is not found. */
export async function templateOfFirm(em: EntityManager, companyId: string, id: string): Promise<MailTemplate> {
  if (!isId(id)) throw new NotFound('No such template.');
  const template = await em.findOne(MailTemplate, { id, company: companyId });
  if (!template) throw new NotFound('No such template.');
  return template;
}

export async function createTemplate(em: EntityManager, companyId: string, input: Required<MailTemplateInput>): Promise<MailTemplate> {
  const existing = await templatesOfFirm(em, companyId);
  if (existing.length >= MAX_TEMPLATES) {
    throw new InvalidInput(`A firm can keep at most ${MAX_TEMPLATES} templates.`, { name: `At most ${MAX_TEMPLATES} templates; remove one first.` });
  }
  const position = Math.max(0, ...existing.map((t) => t.position)) + 1;
  const template = em.create(MailTemplate, { company: companyId, ...input, position });
  await em.flush();
  return template;
}

export async function updateTemplate(em: EntityManager, companyId: string, id: string, input: Required<MailTemplateInput>): Promise<MailTemplate> {
  const template = await templateOfFirm(em, companyId, id);
  Object.assign(template, input);
  await em.flush();
  return template;
}

export async function deleteTemplate(em: EntityManager, companyId: string, id: string): Promise<void> {
  const template = await templateOfFirm(em, companyId, id);
  await em.remove(template).flush();
}
