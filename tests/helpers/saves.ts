import type { TestApp } from './test-app.js';

/**
 * Saves made from the version stored right now, for tests that are about what is saved rather than about
 * two people saving at once (tests/api/lost-updates.test.ts covers that): each reads the current version
 * first and sends it as the save's baseVersion.
 */
type Agent = Awaited<ReturnType<TestApp['signIn']>>;

export async function putChannels(agent: Agent, revisionId: number, body: object) {
  const { version } = (await agent.get(`/api/revisions/${revisionId}`)).body.revision;
  return agent.put(`/api/revisions/${revisionId}/channels`).send({ ...body, baseVersion: version });
}

export async function putMarginInputs(agent: Agent, revisionId: number, inputs: object) {
  const { version } = (await agent.get(`/api/revisions/${revisionId}/margin-inputs`)).body;
  return agent.put(`/api/revisions/${revisionId}/margin-inputs`).send({ ...inputs, baseVersion: version });
}

export async function putPoints(agent: Agent, sessionId: number, body: object) {
  const { pointsVersion } = (await agent.get(`/api/calibrations/${sessionId}`)).body.session;
  return agent.put(`/api/calibrations/${sessionId}/points`).send({ ...body, baseVersion: pointsVersion });
}

export async function patchPoint(agent: Agent, sessionId: number, pointId: number, body: object) {
  const { pointsVersion } = (await agent.get(`/api/calibrations/${sessionId}`)).body.session;
  return agent.patch(`/api/calibrations/${sessionId}/points/${pointId}`).send({ ...body, baseVersion: pointsVersion });
}
