/** Metrics, intervals, paired tests, permutation p-values and multiple-testing adjustment. */
package org.viewgain.stats;
