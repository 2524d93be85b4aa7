/** Command-line commands (picocli): parse, call the engine, print; no experiment logic here. */
package org.viewgain.cli;
