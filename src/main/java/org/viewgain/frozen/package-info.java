/** The binary encoding of fitted steps, imputers and models frozen into a bundle ({@code docs/bundle.md}). */
package org.viewgain.frozen;
