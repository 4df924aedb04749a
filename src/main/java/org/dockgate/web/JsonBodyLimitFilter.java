package org.dockgate.web;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ReadListener;
import jakarta.servlet.ServletException;
import jakarta.servlet.ServletInputStream;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletRequestWrapper;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.core.Ordered;
import org.springframework.core.annotation.Order;
import org.springframework.stereotype.Component;
import org.springframework.util.unit.DataSize;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * Refuses JSON request bodies above {@code dockgate.json.max-body-size} (default 2 MB) with a 413 problem
 * document, before anything parses them: a declared length above the limit is refused at once, a body
 * without a declared length (chunked) is counted while it is read and refused when it passes the limit.
 * Uploads (multipart) have their own limit.
 */
@Component
@Order(Ordered.HIGHEST_PRECEDENCE + 10)
public class JsonBodyLimitFilter extends OncePerRequestFilter {

    private final long limit;
    private final String inWords;
    private final ProblemWriter problems;

    JsonBodyLimitFilter(@Value("${dockgate.json.max-body-size:2MB}") DataSize limit, ProblemWriter problems) {
        this.limit = limit.toBytes();
        this.inWords = UploadLimitAdvice.inWords(limit);
        this.problems = problems;
    }

    String message() {
        return "The JSON body is larger than the " + inWords + " Dockgate accepts. Nothing was saved.";
    }

    @Override
    protected void doFilterInternal(HttpServletRequest request, HttpServletResponse response, FilterChain chain)
            throws ServletException, IOException {
        String type = request.getContentType();
        boolean json = type != null && (type.toLowerCase(java.util.Locale.ROOT).contains("json"));
        if (!json) {
            chain.doFilter(request, response);
            return;
        }
        if (request.getContentLengthLong() > limit) {
            problems.write(response, 413, null, message());
            return;
        }
        chain.doFilter(new Counting(request), response);
    }

    /** Thrown by the counted stream when a body without a declared length passes the limit. */
    public static final class BodyTooLargeException extends RuntimeException {
        BodyTooLargeException(String message) {
            super(message);
        }
    }

    private final class Counting extends HttpServletRequestWrapper {
        private ServletInputStream stream;

        Counting(HttpServletRequest request) {
            super(request);
        }

        @Override
        public ServletInputStream getInputStream() throws IOException {
            if (stream == null) {
                ServletInputStream in = super.getInputStream();
                stream = new ServletInputStream() {
                    private long count;

                    private void add(long n) {
                        if (n > 0 && (count += n) > limit) {
                            throw new BodyTooLargeException(message());
                        }
                    }

                    @Override
                    public int read() throws IOException {
                        int b = in.read();
                        if (b >= 0) {
                            add(1);
                        }
                        return b;
                    }

                    @Override
                    public int read(byte[] b, int off, int len) throws IOException {
                        int n = in.read(b, off, len);
                        add(n);
                        return n;
                    }

                    @Override
                    public boolean isFinished() {
                        return in.isFinished();
                    }

                    @Override
                    public boolean isReady() {
                        return in.isReady();
                    }

                    @Override
                    public void setReadListener(ReadListener listener) {
                        in.setReadListener(listener);
                    }
                };
            }
            return stream;
        }
    }
}
