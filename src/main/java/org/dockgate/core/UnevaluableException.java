package org.dockgate.core;

/**
 * Thrown when the input is well-formed but cannot be evaluated, for example fewer than two distinct
 * inputs for a line fit, a zero span, or a lot offered to a sampling scheme whose acceptance
 * procedures have been discontinued. Malformed input (NaN, infinite, empty, unknown names) is an
 * {@link IllegalArgumentException} instead; the web layer maps this exception to 422 and that one to 400.
 */
public class UnevaluableException extends RuntimeException {

    private static final long serialVersionUID = 1L;

    /**
     * Creates the exception.
     *
     * @param message a human-readable explanation of why the input cannot be evaluated
     */
    public UnevaluableException(String message) {
        super(message);
    }
}
