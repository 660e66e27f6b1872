/** `/api/guardians`: links, consent, digest opt-in and the child summary. */
import { idSchema } from '../id-param';
import { Router } from 'express';
import { consentSchema, createLinkSchema, digestOptInSchema } from '../../shared/schemas/mail';
import { requireRole } from '../auth/passport';
import { parseOrThrow } from '../errors';
import { scopeOf } from '../scope/scope.middleware';
import { CONSENT_TEXT } from './consent-text';
import type { GuardiansService } from './guardians.service';

/** Builds the guardians router (behind authentication and scope). */
export function guardiansRouter(guardians: GuardiansService): Router {
  const router = Router();
  router.get('/consent-text', (_req, res) => {
    res.json(CONSENT_TEXT);
  });
  router.get('/links', requireRole('admin', 'guardian'), (req, res) => {
    res.json({ links: guardians.list(scopeOf(req).user) });
  });
  router.post('/links', requireRole('admin'), (req, res) => {
    const body = parseOrThrow(createLinkSchema, req.body, 'Guardian link');
    res.status(201).json({ link: guardians.create(scopeOf(req).user, body.guardianUserId, body.playerId, body.relationship) });
  });
  router.delete('/links/:id', requireRole('admin'), (req, res) => {
    guardians.remove(scopeOf(req).user, parseOrThrow(idSchema, req.params['id'], 'Link id', 'id'));
    res.status(204).end();
  });
  router.post('/links/:id/consent', requireRole('guardian'), (req, res) => {
    const id = parseOrThrow(idSchema, req.params['id'], 'Link id', 'id');
    res.json({ link: guardians.setConsent(scopeOf(req).user, id, parseOrThrow(consentSchema, req.body, 'Consent')) });
  });
  router.put('/links/:id/digest', requireRole('guardian'), (req, res) => {
    const id = parseOrThrow(idSchema, req.params['id'], 'Link id', 'id');
    const { optIn } = parseOrThrow(digestOptInSchema, req.body, 'Digest opt-in');
    res.json({ link: guardians.setDigestOptIn(scopeOf(req).user, id, optIn) });
  });
  router.get('/children/:playerId/summary', requireRole('guardian'), (req, res) => {
    res.json(guardians.childSummary(scopeOf(req).user, parseOrThrow(idSchema, req.params['playerId'], 'Player id')));
  });
  return router;
}
