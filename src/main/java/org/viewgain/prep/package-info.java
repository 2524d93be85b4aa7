/** Inside-fold transforms fitted on training rows only: scaling, selection, covariate adjustment, harmonization. */
package org.viewgain.prep;
