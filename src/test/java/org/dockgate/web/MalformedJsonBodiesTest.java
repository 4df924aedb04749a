package org.dockgate.web;

import static org.assertj.core.api.Assertions.assertThat;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.csrf;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.user;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.request;

import java.lang.reflect.ParameterizedType;
import java.lang.reflect.RecordComponent;
import java.lang.reflect.Type;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collection;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.dockgate.platform.Role;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.beans.factory.annotation.Qualifier;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.core.MethodParameter;
import org.springframework.http.HttpMethod;
import org.springframework.http.MediaType;
import org.springframework.mock.web.MockHttpServletResponse;
import org.springframework.test.web.servlet.MockMvc;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.method.HandlerMethod;
import org.springframework.web.servlet.mvc.method.RequestMappingInfo;
import org.springframework.web.servlet.mvc.method.annotation.RequestMappingHandlerMapping;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Fuzzes every JSON endpoint (found in the handler mapping, so a new one is covered without editing this
 * test) with malformed bodies: wrong types, null, NaN, Infinity, 1e999, truncated JSON, arrays for
 * objects, huge strings. Each answer must be a 4xx problem document in words, naming the field where
 * one applies, and never quoting a Java class or package.
 */
@SpringBootTest
@AutoConfigureMockMvc
class MalformedJsonBodiesTest {

    /** What a person must never read in an answer: the parser's and the JVM's vocabulary. */
    static final List<String> FORBIDDEN = List.of("java.", "org.", "com.fasterxml", "tools.jackson", "Exception",
            "`", "Ljava", "class ");

    private static final Pattern VARIABLE = Pattern.compile("\\{([^}/]+)}");

    @Autowired MockMvc mvc;
    @Autowired JsonMapper json;
    @Autowired @Qualifier("requestMappingHandlerMapping") RequestMappingHandlerMapping mappings;

    /** A JSON endpoint and the type of its body. */
    record Endpoint(HttpMethod method, String pattern, Type body) {
        String path() {
            Matcher m = VARIABLE.matcher(pattern);
            StringBuilder out = new StringBuilder();
            while (m.find()) {
                m.appendReplacement(out, m.group(1).toLowerCase().contains("id") ? "987654321" : "NO-SUCH-1");
            }
            m.appendTail(out);
            return out.toString();
        }
    }

    /** One malformed body; {@code field} is the path the answer must name, or null. */
    record Case(String body, String field, String what) {
    }

    List<Endpoint> jsonEndpoints() {
        List<Endpoint> found = new ArrayList<>();
        for (Map.Entry<RequestMappingInfo, HandlerMethod> e : mappings.getHandlerMethods().entrySet()) {
            MethodParameter body = Arrays.stream(e.getValue().getMethodParameters())
                    .filter(p -> p.hasParameterAnnotation(RequestBody.class)).findFirst().orElse(null);
            if (body == null) {
                continue;
            }
            for (String pattern : e.getKey().getPatternValues()) {
                for (var method : e.getKey().getMethodsCondition().getMethods()) {
                    found.add(new Endpoint(HttpMethod.valueOf(method.name()), pattern, body.getGenericParameterType()));
                }
            }
        }
        return found;
    }

    @Test
    void everyJsonEndpointAnswersMalformedBodiesWithAProblemDocumentNamingTheField() throws Exception {
        List<Endpoint> endpoints = jsonEndpoints();
        // The API's JSON endpoints and the bench page's autosave: if this drops, the scan lost them.
        assertThat(endpoints).hasSizeGreaterThanOrEqualTo(15);
        List<String> failures = new ArrayList<>();
        int requests = 0;
        for (Endpoint endpoint : endpoints) {
            for (Case c : cases(endpoint.body())) {
                requests++;
                String failure = check(endpoint, c);
                if (failure != null) {
                    failures.add(endpoint.method() + " " + endpoint.pattern() + " with " + c.what() + ": " + failure);
                }
            }
        }
        assertThat(requests).isGreaterThan(300);
        assertThat(failures).as("%d of %d malformed requests", failures.size(), requests).isEmpty();
    }

    private String check(Endpoint endpoint, Case c) throws Exception {
        var request = request(endpoint.method(), endpoint.path()).contentType(MediaType.APPLICATION_JSON)
                .accept(MediaType.APPLICATION_JSON).content(c.body())
                .with(user("engineer").roles(Arrays.stream(Role.values()).map(Role::name).toArray(String[]::new)));
        if (!endpoint.pattern().startsWith("/api/")) {
            request.with(csrf());
        }
        MockHttpServletResponse response = mvc.perform(request).andReturn().getResponse();
        String body = response.getContentAsString();
        String brief = body.length() > 300 ? body.substring(0, 300) + "…" : body;
        if (response.getStatus() < 400 || response.getStatus() >= 500) {
            return "status " + response.getStatus() + " " + brief;
        }
        if (response.getContentType() == null
                || !MediaType.APPLICATION_PROBLEM_JSON.isCompatibleWith(MediaType.parseMediaType(response.getContentType()))) {
            return "content type " + response.getContentType() + " " + brief;
        }
        for (String word : FORBIDDEN) {
            if (body.contains(word)) {
                return "quotes '" + word + "': " + brief;
            }
        }
        JsonNode problem = json.readTree(body);
        if (!problem.path("detail").isString() || problem.path("detail").asString().isBlank()
                || problem.path("status").asInt() != response.getStatus() || !problem.path("title").isString()) {
            return "not a problem document: " + brief;
        }
        if (c.field() != null && response.getStatus() == 400) {
            String detail = problem.path("detail").asString();
            if (!detail.contains(c.field()) || !c.field().equals(problem.path("field").asString(null))) {
                return "does not name '" + c.field() + "': " + brief;
            }
        }
        return null;
    }

    /** Whole-body damage for any endpoint, then one bad value per field of the body's record (nested too). */
    List<Case> cases(Type bodyType) {
        List<Case> cases = new ArrayList<>(List.of(
                new Case("", null, "an empty body"),
                new Case("{\"a\":", null, "truncated JSON"),
                new Case("{\"a\": 1", null, "JSON without its closing brace"),
                new Case("{\"a\": tru}", null, "a misspelt literal"),
                new Case("[]", null, "an array for an object"),
                new Case("[{}]", null, "an array of objects for an object"),
                new Case("\"text\"", null, "a string for an object"),
                new Case("42", null, "a number for an object"),
                new Case("null", null, "null for an object"),
                new Case("{} {}", null, "two documents"),
                new Case("\"" + "x".repeat(300_000) + "\"", null, "a huge string for an object"),
                new Case("[".repeat(5_000) + "]".repeat(5_000), null, "deep nesting"),
                new Case("{\"a\": " + "9".repeat(2_000) + "}", null, "a 2000-digit number")));
        if (bodyType instanceof Class<?> type && type.isRecord()) {
            RecordComponent first = type.getRecordComponents()[0];
            cases.add(new Case(wrap(first.getName(), "\"" + "y".repeat(200_000) + "\""), null,
                    first.getName() + " = a huge string"));
            fieldCases(type, "", 0, cases);
        }
        return cases;
    }

    private void fieldCases(Class<?> record, String prefix, int depth, List<Case> out) {
        for (RecordComponent component : record.getRecordComponents()) {
            String path = prefix + component.getName();
            out.add(new Case(wrap(path, "null"), null, path + " = null"));
            valueCases(component.getType(), component.getGenericType(), path, depth, out);
        }
    }

    private void valueCases(Class<?> type, Type generic, String path, int depth, List<Case> out) {
        if (isNumber(type)) {
            for (String bad : List.of("\"abc\"", "{}", "[[1]]", "NaN", "Infinity", "-Infinity", "1e999", "-1e999",
                    "\"NaN\"", "\"Infinity\"", "true")) {
                // 1e999 is a valid decimal; the endpoint judges its size (and may first name another field)
                boolean decimal = type == BigDecimal.class && bad.endsWith("1e999");
                out.add(new Case(wrap(path, bad), decimal ? null : path, path + " = " + bad));
            }
            if (type != Double.class && type != double.class && type != BigDecimal.class) {
                out.add(new Case(wrap(path, "99999999999999999999"), path, path + " = 99999999999999999999"));
                out.add(new Case(wrap(path, "1.5"), path, path + " = 1.5"));
            }
        } else if (type == String.class) {
            out.add(new Case(wrap(path, "{}"), path, path + " = {}"));
            if (!path.endsWith("]")) {
                // (inside a list of texts, ["a"] is read as "a")
                out.add(new Case(wrap(path, "[\"a\"]"), path, path + " = [\"a\"]"));
            }
        } else if (type.isEnum()) {
            out.add(new Case(wrap(path, "\"NO_SUCH_VALUE\""), path, path + " = an unknown name"));
            out.add(new Case(wrap(path, "{}"), path, path + " = {}"));
        } else if (type == Boolean.class || type == boolean.class) {
            out.add(new Case(wrap(path, "\"maybe\""), path, path + " = maybe"));
        } else if (Collection.class.isAssignableFrom(type) || type.isArray()) {
            out.add(new Case(wrap(path, "\"not a list\""), path, path + " = a string for a list"));
            out.add(new Case(wrap(path, "{}"), path, path + " = an object for a list"));
            Class<?> element = type.isArray() ? type.getComponentType() : typeArgument(generic, 0);
            if (element != null && depth < 3) {
                valueCases(element, null, path + "[0]", depth + 1, out);
            }
        } else if (Map.class.isAssignableFrom(type)) {
            out.add(new Case(wrap(path, "[]"), path, path + " = an array for an object"));
            out.add(new Case(wrap(path, "\"text\""), path, path + " = a string for an object"));
            Class<?> value = typeArgument(generic, 1);
            if (value != null && depth < 3) {
                valueCases(value, null, path + ".key", depth + 1, out);
            }
        } else if (type.isRecord()) {
            out.add(new Case(wrap(path, "[]"), path, path + " = an array for an object"));
            out.add(new Case(wrap(path, "\"text\""), path, path + " = a string for an object"));
            if (depth < 3) {
                fieldCases(type, path + ".", depth + 1, out);
            }
        }
    }

    private static boolean isNumber(Class<?> type) {
        return Set.of(Double.class, double.class, Float.class, float.class, Integer.class, int.class, Long.class,
                long.class, BigDecimal.class, Short.class, short.class).contains(type);
    }

    private static Class<?> typeArgument(Type generic, int index) {
        if (generic instanceof ParameterizedType p && p.getActualTypeArguments().length > index
                && p.getActualTypeArguments()[index] instanceof Class<?> c) {
            return c;
        }
        if (generic instanceof ParameterizedType p && p.getActualTypeArguments().length > index
                && p.getActualTypeArguments()[index] instanceof ParameterizedType inner
                && inner.getRawType() instanceof Class<?> c) {
            return c;
        }
        return null;
    }

    /** {"a": {"b": [ {"c": value} ]}} for the path a.b[0].c (a map key is written as it is). */
    static String wrap(String path, String value) {
        List<String> steps = new ArrayList<>();
        Matcher m = Pattern.compile("([^.\\[\\]]+)|\\[(\\d+)]").matcher(path);
        while (m.find()) {
            steps.add(m.group(1) != null ? m.group(1) : "[]");
        }
        String out = value;
        for (int i = steps.size() - 1; i >= 0; i--) {
            out = steps.get(i).equals("[]") ? "[" + out + "]" : "{\"" + steps.get(i) + "\": " + out + "}";
        }
        return out;
    }

    @Test
    void theWrapperBuildsNestedBodies() {
        assertThat(wrap("a.b[0].c", "1")).isEqualTo("{\"a\": {\"b\": [{\"c\": 1}]}}");
        assertThat(wrap("points[0]", "NaN")).isEqualTo("{\"points\": [NaN]}");
        assertThat(new TreeSet<>(jsonEndpoints().stream().map(Endpoint::pattern).toList()))
                .contains("/api/v1/procedures/derive", "/api/v1/lots/{id}/certificates", "/bench/lots/{lotId}/autosave");
    }
}
