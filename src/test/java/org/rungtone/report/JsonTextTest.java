package org.rungtone.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;

class JsonTextTest {
    private static Map<String, Object> tree() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("schema_version", 2);
        m.put("text", "quote \" backslash \\ tab \t line \n return \r back \b feed \f bell \u0007 nul \u0000");
        m.put("html & friends", "<b>a=b</b> 'single' `tick` \u2028 \u2029 caf\u00e9 \u00b10.5 LSB \u2013 \ud83c\udfb5");
        m.put("doubles", Arrays.asList(0.0, -0.0, 1.0, -1.5, 1e-7, 123456789.125, 1e21, 3.0e-300,
                Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.MIN_VALUE));
        m.put("whole", Arrays.asList(0, -7, Integer.MAX_VALUE, Long.MIN_VALUE, 10_000_000_000L));
        m.put("flags", List.of(true, false));
        m.put("nothing", null);
        m.put("empty_map", Map.of());
        m.put("empty_list", List.of());
        m.put("arrays", List.of(new double[] {0.25, Double.NaN, -3}, new int[] {1, -2, 3}, new double[0],
                new int[0]));
        Map<String, Object> inner = new LinkedHashMap<>();
        inner.put("list_of_maps", List.of(Map.of("a", 1), new LinkedHashMap<>()));
        List<Object> nested = new ArrayList<>();
        nested.add(null);
        nested.add(List.of(List.of("deep")));
        inner.put("nested", nested);
        m.put("inner", inner);
        return m;
    }

    @Test
    void printsWhatGsonPrints() {
        Map<String, Object> t = tree();
        assertTrue(JsonText.writable(t));
        assertEquals(Json.viaGson(t), Json.toJson(t));
        assertEquals(Json.viaGson(List.of()), Json.toJson(List.of()));
        assertEquals(Json.viaGson("top"), Json.toJson("top"));
        assertEquals(Json.viaGson(2.5), Json.toJson(2.5));
    }

    @Test
    void leavesOtherValuesToGson() {
        record Point(double x, String name) {
        }
        assertFalse(JsonText.writable(Map.of("p", new Point(1, "a"))));
        assertFalse(JsonText.writable(Map.of(1, "integer key")));
        assertFalse(JsonText.writable(List.of(1.5f)));
        assertFalse(JsonText.writable(Optional.empty()));
        assertEquals("{\n  \"p\": {\n    \"x\": 1.0,\n    \"name\": \"a\"\n  }\n}\n",
                Json.toJson(Map.of("p", new Point(1, "a"))));
    }
}
