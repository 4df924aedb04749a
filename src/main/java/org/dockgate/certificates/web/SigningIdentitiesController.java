package org.dockgate.certificates.web;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.security.Principal;
import java.util.List;
import java.util.Set;
import java.util.stream.Collectors;
import org.dockgate.accounts.AccountService;
import org.dockgate.accounts.Person;
import org.dockgate.certificates.SigningAuthority;
import org.dockgate.certificates.SigningIdentity;
import org.dockgate.certificates.SigningIdentityService;
import org.dockgate.platform.Role;
import org.springframework.http.ContentDisposition;
import org.springframework.http.HttpHeaders;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.stereotype.Controller;
import org.springframework.ui.Model;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.multipart.MultipartFile;
import org.springframework.web.servlet.mvc.support.RedirectAttributes;

/** ADMIN: the lab's CA, imported CAs, who may sign; grant, revoke, import. */
@Controller
@RequestMapping("/admin/signing")
class SigningIdentitiesController {

    static final String VIEW = "certificates/signing";

    private final SigningIdentityService identities;
    private final AccountService accounts;

    SigningIdentitiesController(SigningIdentityService identities, AccountService accounts) {
        this.identities = identities;
        this.accounts = accounts;
    }

    @GetMapping
    String page(Model model) {
        var overview = identities.overview();
        Set<String> active = overview.identities().stream().filter(SigningIdentity::active)
                .map(SigningIdentity::username).collect(Collectors.toSet());
        List<Person> eligible = accounts.all().stream()
                .filter(p -> p.enabled() && (p.has(Role.ENGINEER) || p.has(Role.SUPERVISOR)))
                .filter(p -> !active.contains(p.username())).toList();
        model.addAttribute("overview", overview);
        model.addAttribute("eligible", eligible);
        return VIEW;
    }

    @PostMapping("/grant")
    String grant(@RequestParam(defaultValue = "") String username, Principal principal, RedirectAttributes redirect) {
        return act(redirect, () -> {
            SigningIdentity identity = identities.grant(username, principal.getName());
            return "Signing rights granted to " + identity.displayName() + ": certificate " + identity.serialHex() + ".";
        });
    }

    @PostMapping("/{id}/revoke")
    String revoke(@PathVariable long id, @RequestParam long version, @RequestParam(defaultValue = "") String reason,
                  Principal principal, RedirectAttributes redirect) {
        return act(redirect, () -> {
            SigningIdentity identity = identities.revoke(id, version, reason, principal.getName());
            return "Signing rights of " + identity.displayName() + " revoked. Documents signed before stay verifiable.";
        });
    }

    @PostMapping("/authorities")
    String importAuthority(@RequestParam(name = "file", required = false) MultipartFile file,
                           @RequestParam(defaultValue = "") String password, Principal principal,
                           RedirectAttributes redirect) {
        return act(redirect, () -> {
            SigningAuthority authority = identities.importAuthority(bytes(file), password.toCharArray(),
                    principal.getName());
            return "CA imported: " + authority.subject() + (authority.canIssue()
                    ? ". It issues new signing certificates from now on." : ". It is trusted for verification.");
        });
    }

    @PostMapping("/import")
    String importIdentity(@RequestParam(defaultValue = "") String username,
                          @RequestParam(name = "file", required = false) MultipartFile file,
                          @RequestParam(defaultValue = "") String password, Principal principal,
                          RedirectAttributes redirect) {
        return act(redirect, () -> {
            SigningIdentity identity = identities.importIdentity(username, bytes(file), password.toCharArray(),
                    principal.getName());
            return "Signing certificate of " + identity.displayName() + " imported (" + identity.serialHex() + ").";
        });
    }

    @GetMapping("/authorities/{id}/certificate.pem")
    ResponseEntity<byte[]> authorityPem(@PathVariable long id) {
        return identities.authorities().stream().filter(a -> a.id() == id).findFirst()
                .map(a -> ResponseEntity.ok().contentType(MediaType.parseMediaType("application/x-pem-file"))
                        .header(HttpHeaders.CONTENT_DISPOSITION, ContentDisposition.attachment()
                                .filename("dockgate-ca-" + id + ".pem").build().toString())
                        .body(a.certificatePem().getBytes(StandardCharsets.US_ASCII)))
                .orElse(ResponseEntity.notFound().build());
    }

    private static String act(RedirectAttributes redirect, java.util.function.Supplier<String> action) {
        try {
            redirect.addFlashAttribute("notice", action.get());
        } catch (IllegalArgumentException | IllegalStateException e) {
            redirect.addFlashAttribute("problem", e.getMessage());
        }
        return "redirect:/admin/signing";
    }

    private static byte[] bytes(MultipartFile file) {
        if (file == null || file.isEmpty()) {
            throw new IllegalArgumentException("Choose a PKCS#12 file (.p12 or .pfx).");
        }
        try {
            return file.getBytes();
        } catch (IOException e) {
            throw new IllegalArgumentException("The upload could not be read.");
        }
    }
}
