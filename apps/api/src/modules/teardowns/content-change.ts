import type { EntityManager } from '@mikro-orm/sqlite';
import type { Role } from '@splitcase/contracts';
import { CONTENT_EDITORS, editableTeardown, type TeardownWriter } from './access';
import type { Teardown } from './teardown.entity';

/**
 * Run one change to a teardown's content in a single transaction: the access check (and the move
 * back to draft of a published teardown, with the confirm header), the change and its audit entries
 * commit together or not at all. `fn` may flush to get ids; the transaction flushes at the end.
 */
export function changeTeardownContent<T>(ctx: TeardownWriter, teardownId: number, fn: (tx: EntityManager, teardown: Teardown) => Promise<T>, roles: readonly Role[] = CONTENT_EDITORS): Promise<T> {
  return ctx.em.transactional(async (tx) => {
    const teardown = await editableTeardown({ em: tx as EntityManager, user: ctx.user, confirmUnpublish: ctx.confirmUnpublish }, teardownId, roles);
    return fn(tx as EntityManager, teardown);
  });
}
