/**
 * The run lifecycle between the commands and the engine: a fresh run, a resumed one, a shard and a merge of shards,
 * their status in {@code run.json} (written here and nowhere else) and what a failure leaves behind.
 */
package org.viewgain.run;
