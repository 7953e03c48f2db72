/** Reports for people and machines: aligned text tables, JSON and PNG plots. */
package org.rungtone.report;
