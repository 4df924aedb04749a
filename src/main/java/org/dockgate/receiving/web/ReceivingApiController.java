package org.dockgate.receiving.web;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.media.Content;
import io.swagger.v3.oas.annotations.media.ExampleObject;
import io.swagger.v3.oas.annotations.responses.ApiResponse;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.time.LocalDate;
import java.util.List;
import org.dockgate.receiving.LotState;
import org.dockgate.receiving.LotView;
import org.dockgate.receiving.NewLot;
import org.dockgate.receiving.NewReceipt;
import org.dockgate.receiving.ReceiptView;
import org.dockgate.receiving.ReceivingService;
import org.springframework.http.HttpStatus;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

@RestController
@Tag(name = "Receiving", description = "Receipts, lots, their sampling plans and drawn samples")
class ReceivingApiController {

    private final ReceivingService receiving;

    ReceivingApiController(ReceivingService receiving) {
        this.receiving = receiving;
    }

    record LotRequest(Long modelId, Integer quantity, List<String> serials) {
    }

    record ReceiptRequest(String purchaseOrder, String deliveryNote, LocalDate receivedOn, Long supplierId,
                          List<LotRequest> lots, String clientToken) {
    }

    @GetMapping("/api/v1/receipts")
    @Operation(summary = "List receipts with their lots, newest first")
    List<ReceiptView> receipts() {
        return receiving.receipts();
    }

    @PostMapping("/api/v1/receipts")
    @Operation(summary = "Record a receipt",
            description = "Each lot's serials must be unique, non-blank and as many as its quantity; the model needs an"
                    + " approved procedure and the supplier must not be disqualified or discontinued for that model."
                    + " The lot's ISO 2859-1 plan is computed and its sample drawn with a recorded seed. Sending the same"
                    + " clientToken again with the same content returns the receipt already saved; the same token with"
                    + " other content or from another user is refused with 409.",
            requestBody = @io.swagger.v3.oas.annotations.parameters.RequestBody(content = @Content(
                    examples = @ExampleObject(value = """
                    {"purchaseOrder": "PO-4711", "deliveryNote": "DN-0815", "receivedOn": "2026-03-02", "supplierId": 1,
                     "clientToken": "7f1c2d9e-1",
                     "lots": [{"modelId": 1, "quantity": 3, "serials": ["A1001", "A1002", "A1003"]}]}"""))),
            responses = {@ApiResponse(responseCode = "201", description = "Saved (or already saved with this token)"),
                    @ApiResponse(responseCode = "400", description = "Refused; detail names the problem,"
                            + " e.g. \"12 serials for a quantity of 13.\"")})
    ResponseEntity<ReceiptView> receive(@RequestBody ReceiptRequest request) {
        List<NewLot> lots = request.lots() == null ? List.of()
                : request.lots().stream().map(l -> l == null ? new NewLot(null, null, null)
                        : new NewLot(l.modelId(), l.quantity(), l.serials())).toList();
        ReceiptView saved = receiving.receive(new NewReceipt(request.purchaseOrder(), request.deliveryNote(),
                request.receivedOn(), request.supplierId(), lots, request.clientToken()));
        return ResponseEntity.status(HttpStatus.CREATED).body(saved);
    }

    @GetMapping("/api/v1/lots")
    @Operation(summary = "List lots, newest first", description = "Optional state: AWAITING_MEASUREMENT,"
            + " DISPOSITIONED_ACCEPTED or DISPOSITIONED_REJECTED.")
    List<LotView> lots(@RequestParam(required = false) LotState state) {
        return receiving.lots(state);
    }

    @GetMapping("/api/v1/lots/{id}")
    @Operation(summary = "One lot: serials, plan, drawn sample with its seed, revisions fixed at receipt, state")
    ResponseEntity<LotView> lot(@PathVariable long id) {
        return ResponseEntity.ok(receiving.lot(id).orElseThrow(org.dockgate.web.NotFoundException.of("There is no lot " + id + ".")));
    }
}
