/** The experiment spec: immutable records, YAML loading and validation with key paths and line numbers; typed method parameters. */
package org.viewgain.spec;
