import { Directive, input } from '@angular/core';
import type { Params } from '@angular/router';

/**
 * The query parameters both lists of readings (the Readings table, the review queue) keep in the
 * URL, bound by the router to inputs of the same name (component input binding). They arrive as
 * the address spells them; each page's own parse checks them and drops what is malformed.
 */
@Directive()
export abstract class ReadingListParams {
  readonly accessionId = input<string>();
  readonly characterId = input<string>();
  readonly siteId = input<string>();
  readonly observerId = input<string>();
  readonly status = input<string>();
  readonly from = input<string>();
  readonly to = input<string>();
  readonly page = input<string>();
  readonly pageSize = input<string>();

  /** The parameters above as one object, for the page's parse. */
  protected listParams(): Params {
    return {
      accessionId: this.accessionId(),
      characterId: this.characterId(),
      siteId: this.siteId(),
      observerId: this.observerId(),
      status: this.status(),
      from: this.from(),
      to: this.to(),
      page: this.page(),
      pageSize: this.pageSize(),
    };
  }
}
