/** Subjects, views and their loaders (matrix directories, edge tables), graph feature extraction. */
package org.viewgain.cohort;
