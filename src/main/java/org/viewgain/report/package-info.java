/** Writers of tidy CSV and JSON results, provenance and the HTML report. */
package org.viewgain.report;
