/** View imputers behind the ViewImputer interface, cross-fitting and imputation quality. */
package org.viewgain.imputation;
