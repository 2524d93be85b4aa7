/** Classifiers behind the ClassifierMethod interface: Smile and Weka adapters, hyperparameter grids. */
package org.viewgain.classify;
