package org.dockgate.audit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestBuilders.formLogin;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.user;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import java.io.StringReader;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.dockgate.platform.CsvCells;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.test.web.servlet.MockMvc;

/** A user name tried at sign-in must reach the audit export as text, never as a live spreadsheet formula. */
@SpringBootTest
@AutoConfigureMockMvc
class AuditCsvInjectionTest {

    @Autowired MockMvc mvc;

    @Test
    void aFormulaTriedAsUserNameIsExportedAsText() throws Exception {
        mvc.perform(formLogin("/login").user("=1+2*cmd|x").password("whatever"));
        String body = mvc.perform(get("/audit/export.csv").param("action", "LOGIN_FAILED")
                        .with(user("auditor").roles("AUDITOR")))
                .andExpect(status().isOk()).andReturn().getResponse().getContentAsString();
        List<String> cells = new ArrayList<>();
        for (CSVRecord record : CSVFormat.DEFAULT.parse(new StringReader(body))) {
            record.forEach(cells::add);
        }
        assertThat(cells).contains("'=1+2*cmd|x");
        assertThat(cells).noneMatch(c -> !c.isEmpty() && "=+@\t\r".indexOf(c.charAt(0)) >= 0);
    }

    @ParameterizedTest
    @ValueSource(strings = {"=1+2", "+SUM(A1)", "-2+3", "-A1", "@cmd", "\tx", "\rx", "-", "+"})
    void formulaLikeTextGetsAnApostrophe(String text) {
        assertThat(CsvCells.safe(text)).isEqualTo("'" + text);
    }

    @ParameterizedTest
    @ValueSource(strings = {"-0.5", "+1.2E-3", "42", "-.5", "plain text", "a=b", ""})
    void plainNumbersAndOrdinaryTextStayAsTheyAre(String text) {
        assertThat(CsvCells.safe(text)).isEqualTo(text);
    }

    @Test
    void numericValuesAreData() {
        assertThat(CsvCells.safe(-0.5)).isEqualTo(-0.5);
        assertThat(CsvCells.safe(-3L)).isEqualTo(-3L);
        assertThat(CsvCells.safe(null)).isNull();
    }
}
