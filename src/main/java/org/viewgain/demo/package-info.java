/** The invented demo cohort generator. */
package org.viewgain.demo;
