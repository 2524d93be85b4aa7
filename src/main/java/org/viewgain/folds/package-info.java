/** Fold plans (stratified k-fold, repeated, leave-one-out, leave-site-out), seed derivation and fit contexts. */
package org.viewgain.folds;
