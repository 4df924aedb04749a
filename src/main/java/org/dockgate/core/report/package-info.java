/**
 * How results are written for people: measured values with their expanded uncertainty, stated limits,
 * intervals and one-sided limits, coverage factors, dates and times. One formatter for pages, PDFs and
 * CSV exports, so a number reads the same wherever it appears.
 */
package org.dockgate.core.report;
