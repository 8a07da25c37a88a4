import type { KyselyPlugin, PluginTransformQueryArgs, PluginTransformResultArgs, QueryResult, RootOperationNode, UnknownRow } from 'kysely';

/**
 * Counts the statements a database runs while `counting` is on (use with `db.withPlugin`). It
 * counts results, one per statement run: subqueries pass through `transformQuery` too.
 */
export class StatementCounter implements KyselyPlugin {
  counting = true;
  statements = 0;
  transformQuery({ node }: PluginTransformQueryArgs): RootOperationNode {
    return node;
  }
  async transformResult({ result }: PluginTransformResultArgs): Promise<QueryResult<UnknownRow>> {
    if (this.counting) this.statements++;
    return result;
  }
}
