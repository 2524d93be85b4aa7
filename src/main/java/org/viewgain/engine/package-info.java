/** Nested cross-validation: work units, scheduling, pipelines, result collection. */
package org.viewgain.engine;
